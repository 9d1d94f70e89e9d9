using PlaneLateral.Analysis;
using PlaneLateral.Hand;
using PlaneLateral.Model;

namespace PlaneLateral.Studies;

/// <summary>
/// What an FE model of a coupled wall reports under one load case. SI (N, m). Floors are numbered from 1 (the first
/// floor above the base) to the roof; openings from 1 (between pier 1 and pier 2, piers left to right).
/// </summary>
/// <param name="Model">Short name of the FE model, e.g. "wide-column frame".</param>
/// <param name="Description">How the model was built and loaded, in plain words.</param>
/// <param name="LevelHeights">Height of each floor above the base (m).</param>
/// <param name="LevelDisplacements">Lateral displacement of each floor, mean over the piers (m).</param>
/// <param name="PierBaseMoments">Base moment each pier resists (N·m), positive resisting the load's overturning.</param>
/// <param name="PierBaseAxialForces">Axial force at each pier's base (N), tension positive.</param>
/// <param name="BeamShears">[floor − 1][opening − 1]: the shear in each coupling beam (N), positive when it lifts the left pier.</param>
/// <param name="BaseOverturningMoment">M₀, the load's overturning moment about the base (N·m).</param>
public sealed record CoupledWallResponse(string Model, string Description, IReadOnlyList<double> LevelHeights,
    IReadOnlyList<double> LevelDisplacements, IReadOnlyList<double> PierBaseMoments, IReadOnlyList<double> PierBaseAxialForces,
    IReadOnlyList<IReadOnlyList<double>> BeamShears, double BaseOverturningMoment, IReadOnlyList<double> PierCentroids)
{
    /// <summary>Top deflection (m).</summary>
    public double TopDeflection => LevelDisplacements[^1];

    /// <summary>Interstory drift of each story (m), base displacement zero.</summary>
    public IReadOnlyList<double> StoryDrifts => LevelDisplacements.Select((v, i) => v - (i == 0 ? 0.0 : LevelDisplacements[i - 1])).ToArray();

    /// <summary>
    /// The moment of the pier axial forces about the base (N·m): Σ −N_i·x_i (tension on the left resists a load to
    /// the right), independent of the reference point since the axial forces sum to zero under lateral load.
    /// </summary>
    public double AxialCouple => -PierBaseAxialForces.Select((n, i) => n * PierCentroids[i]).Sum();

    /// <summary>
    /// Degree of coupling: the share of the base overturning moment resisted by the axial-force couple,
    /// couple/(couple + ΣM_i) (Hoenderkamp, Sādhanā 37(4):481–492, 2012). Equals couple/M₀ when the base is in equilibrium.
    /// </summary>
    public double DegreeOfCoupling => AxialCouple / (AxialCouple + PierBaseMoments.Sum());
}

/// <summary>
/// An FE model of a coupled wall built from the check's dimensions. The wide-column frame is one; the plane-stress panel
/// of the same wall (<see cref="PanelCoupledWall"/>) is another, reported as one more FE estimate in the same rows.
/// </summary>
public interface ICoupledWallModel
{
    /// <summary>Short name, e.g. "wide-column frame".</summary>
    string Name { get; }

    /// <summary>Solves the wall under the load (w in N/m of height, or P in N at the top).</summary>
    /// <param name="options">The run's options (the user's solver); null for the default solver.</param>
    CoupledWallResponse Solve(CoupledWallCheck wall, CoupledWallLoad load, double magnitude, string source, PlaneLateral.Units.UnitSystem units, AnalysisOptions? options = null);
}

/// <summary>
/// The wide-column frame of a coupled wall: a Timoshenko column at each pier's centroid, one member per story; at every
/// floor a Timoshenko coupling beam from pier centroid to pier centroid whose rigid end zones reach the pier faces
/// (half the pier lengths: exactly the wide-column model's rigid arms, docs/engine.md), flexible over the beam span; the
/// beam's I times the check's beamInertiaFactor, its axial area made stiff (the floor ties the piers). Fixed bases. Uniform load: along pier 1 (global x, per unit height);
/// top load: at pier 1's top node. The floors' axial ties are the coupling beams themselves (their EA).
/// </summary>
/// <param name="ShearDeformation">False: walls and beams with no shear deformation (A_s = ∞), matching the classic
/// continuous-connection form.</param>
public sealed class WideColumnFrame(bool ShearDeformation) : ICoupledWallModel
{
    public string Name => ShearDeformation ? "wide-column frame" : "wide-column frame, no shear deformation";

    public bool WithShear => ShearDeformation;

    /// <summary>
    /// Factor on the coupling beams' axial area (not their shear area): the floors tie the piers so that they deflect
    /// alike, as the continuous medium assumes; a shallow beam's own EA would let them part.
    /// </summary>
    public const double AxialFactor = 1e4;

    /// <summary>
    /// The rigid arms of the coupling beam between piers <paramref name="left"/> and left + 1, from each pier centroid
    /// (m): half the pier's length for the clear-span rule; a quarter beam depth less with "clear-plus-half-depth"
    /// (never below zero).
    /// </summary>
    public static (double Start, double End) RigidArms(CoupledWallCheck c, int left)
    {
        double a = c.Piers[left].Length / 2, b = c.Piers[left + 1].Length / 2;
        if (c.BeamSpan == BeamSpanRule.ClearPlusHalfDepth) { a = Math.Max(0, a - c.BeamDepth / 4); b = Math.Max(0, b - c.BeamDepth / 4); }
        return (a, b);
    }

    /// <summary>The flexible span b of the coupling beam between piers <paramref name="left"/> and left + 1 (m).</summary>
    public static double BeamSpan(CoupledWallCheck c, int left)
    {
        var (a, b) = RigidArms(c, left);
        return c.Piers[left + 1].Centroid - c.Piers[left].Centroid - a - b;
    }

    /// <summary>The structural model of the frame (SI), with one load case "coupled" holding the load.</summary>
    public StructureModel Build(CoupledWallCheck c, CoupledWallLoad load, double magnitude, string source, PlaneLateral.Units.UnitSystem units)
    {
        var sub = new SubModel($"{c.Id}: wide-column frame", source, units);
        var mat = c.Material;
        sub.Uses(mat);
        int np = c.Piers.Count, ns = c.Stories;
        var node = new int[np, ns + 1];
        for (int i = 0; i < np; i++)
            for (int j = 0; j <= ns; j++)
                node[i, j] = sub.NodeAt(c.Piers[i].Centroid, j * c.StoryHeight, $"P{i + 1}-{j}");
        double inf = double.PositiveInfinity;
        var pierMembers = new List<int>();
        for (int i = 0; i < np; i++)
        {
            double a = c.Piers[i].Length * c.Thickness, ii = c.Thickness * Math.Pow(c.Piers[i].Length, 3) / 12;
            for (int j = 0; j < ns; j++)
            {
                var m = new Member(0, $"pier {i + 1} story {j + 1}", 0, 0, MemberKind.BeamColumn, "rectangle", mat.Id, mat.E, mat.G,
                    a, ii, ShearDeformation ? a / c.FormFactor : inf, false, false, 0, 0, StiffnessModifiers.None, "pier");
                int k = sub.Copy(m, node[i, j], node[i, j + 1]);
                if (i == 0) pierMembers.Add(k);
            }
            sub.Support(node[i, 0], true, true, true);
        }
        for (int i = 0; i + 1 < np; i++)
        {
            var (ra, rb) = RigidArms(c, i);
            double a = c.BeamDepth * c.BeamThickness, ib = c.BeamThickness * Math.Pow(c.BeamDepth, 3) / 12;
            for (int j = 1; j <= ns; j++)
            {
                var m = new Member(0, $"beam {i + 1} floor {j}", 0, 0, MemberKind.BeamColumn, "rectangle", mat.Id, mat.E, mat.G,
                    a * AxialFactor, ib * c.BeamInertiaFactor, ShearDeformation ? a / c.FormFactor : inf, false, false, ra, rb,
                    c.BeamInertiaFactor == 1 ? StiffnessModifiers.None : new StiffnessModifiers(c.BeamInertiaFactor, 1, 1), "coupling beam");
                sub.Copy(m, node[i, j], node[i + 1, j]);
            }
        }
        var built = sub.Build();
        var nodal = new List<NodalLoad>();
        var member = new List<MemberLoad>();
        if (load == CoupledWallLoad.TopPoint) nodal.Add(new NodalLoad(node[0, ns], magnitude, 0, 0));
        else foreach (int k in pierMembers) member.Add(new MemberLoad(k, LoadAxes.Global, 0, magnitude, magnitude));
        return new StructureModel
        {
            Title = built.Title, SourcePath = built.SourcePath, Units = built.Units, Materials = built.Materials, Sections = built.Sections,
            Nodes = built.Nodes, Members = built.Members, Supports = built.Supports,
            LoadCases = [new LoadCase("coupled", load == CoupledWallLoad.TopPoint ? "point load at the top" : "uniform load over the height", nodal, member)],
            Combinations = [], StiffnessPoints = [],
        };
    }

    public CoupledWallResponse Solve(CoupledWallCheck c, CoupledWallLoad load, double magnitude, string source, PlaneLateral.Units.UnitSystem units, AnalysisOptions? options = null)
    {
        var model = Build(c, load, magnitude, source, units);
        var r = LinearStaticAnalysis.Run(model, options).Cases[0];
        int np = c.Piers.Count, ns = c.Stories;
        int NodeOf(int i, int j) => model.NodeIndex($"P{i + 1}-{j}");
        var heights = Enumerable.Range(1, ns).Select(j => j * c.StoryHeight).ToArray();
        var disp = Enumerable.Range(1, ns).Select(j => Enumerable.Range(0, np).Average(i => r.Displacement(NodeOf(i, j), Dof.X))).ToArray();
        // Supports were added pier by pier, so reaction i is pier i's base.
        var moments = r.Reactions.Select(x => x.Mz).ToArray();           // a load to the right overturns clockwise; the base answers counter-clockwise (+)
        var axial = r.Reactions.Select(x => -x.Fy).ToArray();            // the support pulls a pier in tension down
        var shears = new List<IReadOnlyList<double>>();
        for (int j = 1; j <= ns; j++)
        {
            var row = new double[np - 1];
            for (int i = 0; i + 1 < np; i++)
            {
                int mi = model.Members.First(m => m.Id == $"beam {i + 1} floor {j}").Index;
                row[i] = r.MemberForces[mi].V2;   // the right pier pushes the beam up; the beam lifts the left pier
            }
            shears.Add(row);
        }
        double h = c.Height;
        double m0 = load == CoupledWallLoad.TopPoint ? magnitude * h : magnitude * h * h / 2;
        string how = $"{np} Timoshenko pier columns at the pier centroids ({ns} members each), {(np - 1) * ns} coupling beams at the floors with rigid arms to the pier faces, flexible over {(c.BeamSpan == BeamSpanRule.ClearOpening ? "the clear opening" : "the clear opening plus half the beam depth")}"
            + (c.BeamInertiaFactor == 1 ? "" : $", beam I × {ComparisonStudy.G4(c.BeamInertiaFactor)}")
            + (ShearDeformation ? $", shear deformation of walls and beams (A/{ComparisonStudy.G4(c.FormFactor)})" : ", no shear deformation (A_s = ∞, as the classic closed form)")
            + $"; fixed bases; {(load == CoupledWallLoad.TopPoint ? "point load at pier 1's top" : "uniform load along pier 1")}";
        return new CoupledWallResponse(Name, how, heights, disp, moments, axial, shears, m0, c.Piers.Select(p => p.Centroid).ToArray());
    }
}
