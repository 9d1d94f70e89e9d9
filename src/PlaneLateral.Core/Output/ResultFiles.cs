using System.Reflection;
using Newtonsoft.Json;
using PlaneLateral.Analysis;
using PlaneLateral.Model;
using PlaneLateral.Units;

namespace PlaneLateral.Output;

/// <summary>
/// Turns an <see cref="AnalysisResult"/> into the results files: one JSON file with everything and CSV tables
/// (displacements, reactions, member forces, checks, stiffness), all in the model's own units. The text depends
/// only on the model, so the same input gives byte-identical files.
/// </summary>
public static class ResultFiles
{
    /// <summary>The caution carried by every output.</summary>
    public const string Caution =
        "Computed results for checking by a licensed engineer; they do not show compliance with any code. The governing local building code and the engineer of record decide.";

    public static string Version =>
        typeof(ResultFiles).Assembly.GetCustomAttribute<AssemblyInformationalVersionAttribute>()?.InformationalVersion.Split('+')[0] ?? "0.0.0";

    /// <summary>Every results file of a run (it only reads the run's results). results.json and the tables that grow
    /// with nodes, members and cases (displacements, reactions, member forces) are streamed into their files as they
    /// are written, never built as one string.</summary>
    public static IReadOnlyList<OutputFile> Files(ModelResult run) =>
    [
        .. Static(run.Analysis),
        .. Texts(BuildingFiles.Render(run)),
        .. PanelResultFiles.Files(run.Analysis),
        .. Texts(PanelLinkFiles.Render(run.Analysis)),
        .. Texts(SeismicFiles.Render(run)),
    ];

    /// <summary>The files of the static results alone (no building or seismic files): JSON, displacements, reactions, member forces, checks, stiffness, panels.</summary>
    public static IReadOnlyList<OutputFile> PlanarFiles(AnalysisResult result) =>
    [
        .. Static(result),
        .. PanelResultFiles.Files(result),
        .. Texts(PanelLinkFiles.Render(result)),
    ];

    /// <summary>File name → text of every results file of a run, built in memory (tests, small models; the command
    /// line writes <see cref="Files"/>).</summary>
    public static IReadOnlyList<(string Name, string Text)> Render(ModelResult run) => InMemory(Files(run));

    /// <summary>File name → text of the files of <see cref="PlanarFiles"/>, built in memory.</summary>
    public static IReadOnlyList<(string Name, string Text)> Planar(AnalysisResult result) => InMemory(PlanarFiles(result));

    private static IEnumerable<OutputFile> Texts(IEnumerable<(string Name, string Text)> files) => files.Select(f => OutputFile.Text(f.Name, f.Text));

    private static (string Name, string Text)[] InMemory(IEnumerable<OutputFile> files) => files.Select(f => (f.Name, f.ToText())).ToArray();

    private static IReadOnlyList<OutputFile> Static(AnalysisResult result) =>
        [TypedJson.File("results.json", Document(result)), .. StaticTables(result).Select(t => t.File())];

    /// <summary>The CSV files of the static results, each from its table: displacements, reactions, member forces (streamed), checks, stiffness.</summary>
    public static IReadOnlyList<CsvTableFile> StaticTables(AnalysisResult result) =>
    [
        new("displacements.csv", DisplacementTable(result)),
        new("reactions.csv", ReactionTable(result)),
        new("member-forces.csv", MemberForceTable(result)),
        new("checks.csv", ChecksTable(result)),
        new("stiffness.csv", StiffnessTable(result)),
    ];

    /// <summary>
    /// Every CSV file of <see cref="Files"/>, in the same order, as the table it is written from: the files' CSV bytes
    /// are these tables' (Output/CsvFromTablesTests holds every shipped model to it).
    /// </summary>
    public static IReadOnlyList<CsvTableFile> CsvTables(ModelResult run) =>
    [
        .. StaticTables(run.Analysis),
        .. BuildingFiles.Tables(run),
        .. PanelResultFiles.Tables(run.Analysis),
        .. PanelLinkFiles.Tables(run.Analysis),
        .. SeismicFiles.Tables(run),
    ];

    /// <summary>Every node's displacements in every case and combination: rows produced as they are read.</summary>
    public static ResultTable DisplacementTable(AnalysisResult r)
    {
        var u = r.Model.Units;
        return new ResultTable
        {
            Title = "Displacements",
            Columns = [new("case", Kind: CellKind.Text), new("node", Kind: CellKind.Text), new("ux", u.LengthSymbol), new("uy", u.LengthSymbol), new("rz", "rad")],
            Rows = r.Cases.SelectMany(c => r.Model.Nodes.Select(n => (IReadOnlyList<object>)
                [c.Id, n.Id, u.FromSI(c.Displacement(n.Index, Dof.X), Quantity.Length), u.FromSI(c.Displacement(n.Index, Dof.Y), Quantity.Length), c.Displacement(n.Index, Dof.RZ)])),
        };
    }

    /// <summary>Every support's reaction, then each wall panel's held base (the resultant of its base reactions, Mz
    /// about the middle of its base: docs/panels.md), in every case and combination: rows produced as they are read.</summary>
    public static ResultTable ReactionTable(AnalysisResult r)
    {
        var u = r.Model.Units;
        IReadOnlyList<object> Row(string caseId, string node, double fx, double fy, double mz) =>
            [caseId, node, u.FromSI(fx, Quantity.Force), u.FromSI(fy, Quantity.Force), u.FromSI(mz, Quantity.Moment)];
        return new ResultTable
        {
            Title = "Reactions",
            Columns = [new("case", Kind: CellKind.Text), new("node", Kind: CellKind.Text), new("Fx", u.ForceSymbol), new("Fy", u.ForceSymbol), new("Mz", u.Label(Quantity.Moment))],
            Rows = r.Cases.SelectMany((c, ci) =>
                c.Reactions.Select(re => Row(c.Id, r.Model.Nodes[re.Node].Id, re.Fx, re.Fy, re.Mz))
                    .Concat(PanelBases(r, ci).Select(p => Row(c.Id, p.Name, p.Fx, p.Fy, p.Mz)))),
        };
    }

    /// <summary>The label and base-reaction resultant (N, N, N·m about the middle of the base) of every wall panel in a case.</summary>
    private static IEnumerable<(WallPanel Panel, string Name, double Fx, double Fy, double Mz)> PanelBases(AnalysisResult r, int caseIndex)
    {
        for (int p = 0; p < r.Panels.Count && p < r.Model.Panels.Count; p++)
        {
            if (caseIndex >= r.Panels[p].Analysis.Cases.Count) continue;
            var (fx, fy, mz) = StoryPanels.BaseReaction(r, p, caseIndex);
            yield return (r.Model.Panels[p], PanelBaseLabel(r.Model.Panels[p]), fx, fy, mz);
        }
    }

    /// <summary>The name a panel's base goes by in reactions.csv: "&lt;panel id&gt; (panel base)".</summary>
    public static string PanelBaseLabel(WallPanel p) => $"{p.Id} (panel base)";

    /// <summary>Every member's end forces (local axes) in every case and combination: rows produced as they are read.</summary>
    public static ResultTable MemberForceTable(AnalysisResult r)
    {
        var u = r.Model.Units;
        string fu = u.ForceSymbol, mu = u.Label(Quantity.Moment);
        return new ResultTable
        {
            Title = "Member end forces",
            Columns =
            [
                new("case", Kind: CellKind.Text), new("member", Kind: CellKind.Text),
                new("N1", fu), new("V1", fu), new("M1", mu), new("N2", fu), new("V2", fu), new("M2", mu),
            ],
            Rows = r.Cases.SelectMany(c => c.MemberForces.Select(m => (IReadOnlyList<object>)
                [c.Id, r.Model.Members[m.Member].Id, u.FromSI(m.N1, Quantity.Force), u.FromSI(m.V1, Quantity.Force), u.FromSI(m.M1, Quantity.Moment),
                 u.FromSI(m.N2, Quantity.Force), u.FromSI(m.V2, Quantity.Force), u.FromSI(m.M2, Quantity.Moment)])),
        };
    }

    /// <summary>Per case: residual, backward error, applied load against reactions and the relative imbalances (checks.csv).</summary>
    public static ResultTable ChecksTable(AnalysisResult r)
    {
        var u = r.Model.Units;
        string fu = u.ForceSymbol, mu = u.Label(Quantity.Moment);
        double Fo(double v) => u.FromSI(v, Quantity.Force);
        double Mo(double v) => u.FromSI(v, Quantity.Moment);
        return new ResultTable
        {
            Title = "Solution checks per case",
            Columns =
            [
                new("case", Kind: CellKind.Text), new("kind", Kind: CellKind.Text), new("relative residual"), new("backward error"),
                new("applied Fx", fu), new("applied Fy", fu), new("applied Mz about origin", mu), new("reaction Fx", fu), new("reaction Fy", fu),
                new("reaction Mz about origin", mu), new("relative force imbalance"), new("relative moment imbalance"),
            ],
            Rows = r.Cases.Select(c => (IReadOnlyList<object>)
                [c.Id, c.IsCombination ? "combination" : "load case", c.RelativeResidual, c.BackwardError, Fo(c.Equilibrium.AppliedFx), Fo(c.Equilibrium.AppliedFy),
                 Mo(c.Equilibrium.AppliedMz), Fo(c.Equilibrium.ReactionFx), Fo(c.Equilibrium.ReactionFy), Mo(c.Equilibrium.ReactionMz),
                 c.Equilibrium.RelativeForceError, c.Equilibrium.RelativeMomentError]).ToList(),
        };
    }

    /// <summary>The lateral stiffness and flexibility at each reported point (stiffness.csv).</summary>
    public static ResultTable StiffnessTable(AnalysisResult r)
    {
        var u = r.Model.Units;
        return new ResultTable
        {
            Title = "Lateral stiffness (force per unit displacement under a single force at the point)",
            Columns =
            [
                new("label", Kind: CellKind.Text), new("node", Kind: CellKind.Text), new("direction", Kind: CellKind.Text),
                new("stiffness", u.Label(Quantity.TranslationalStiffness)), new("flexibility", $"{u.LengthSymbol}/{u.ForceSymbol}"),
            ],
            Rows = r.Stiffness.Select(s => (IReadOnlyList<object>)
                [s.Point.Label, r.Model.Nodes[s.Point.Node].Id, DofNames.Name(s.Point.Direction)[1..],
                 u.FromSI(s.Stiffness, Quantity.TranslationalStiffness), s.Flexibility * u.ForceScale / u.LengthScale]).ToList(),
        };
    }

    /// <summary>results.json as a typed document whose per-case arrays are produced while the file is written.</summary>
    public static ResultsDocument Document(AnalysisResult r)
    {
        var u = r.Model.Units;
        var cond = r.Conditioning;
        return new ResultsDocument(
            ProducedBy: $"PlaneLateral {Version}",
            Caution: Caution,
            Model: new ResultsModel(r.Model.Title, Path.GetFileName(r.Model.SourcePath), r.Model.Nodes.Count, r.Model.Members.Count),
            Units: new ResultsUnits(u.LengthSymbol, u.ForceSymbol, u.Label(Quantity.Moment), "rad", u.Label(Quantity.TranslationalStiffness)),
            Solver: new ResultsSolver(MachineFree.Solver(r.Solve.Solver), r.Solve.Unknowns, r.Solve.MatrixNonZerosLower, r.Solve.FactorNonZeros, r.Solve.RightHandSides),
            Conditioning: cond is null ? null : new ResultsConditioning(
                "1-norm condition estimate from solves with the factor (Hager; Higham 2002, Alg. 15.4); a lower bound, usually within a factor 3",
                cond.Kappa1, cond.ScaledKappa1,
                "kappa1 is of K in SI units (N, m, rad); kappa1Scaled of D^-1/2 K D^-1/2 with D = diag K, free of units",
                cond.Threshold, cond.IllConditioned, cond.LikelyCause),
            Notes: r.Notes,
            // Plausibility of the input (Model/Plausibility.cs); they do not change any number.
            Warnings: r.Model.Warnings.Select(x => new ResultsWarning(x.Line, x.Column, x.JsonPath, x.Problem, x.Fix)),
            SignConvention: "Global X right, Y up, rotations counter-clockwise. Member end forces act on the member's flexible segment at its end faces, in local axes (x from start to end node, y 90° counter-clockwise): N, V positive along local x, y; M counter-clockwise. Axial force, tension positive, is N2.",
            Stiffness: r.Stiffness.Select(s => new ResultsStiffness(s.Point.Label, r.Model.Nodes[s.Point.Node].Id, DofNames.Name(s.Point.Direction)[1..],
                u.FromSI(s.Stiffness, Quantity.TranslationalStiffness),
                "force per unit displacement at this node and direction when a single force acts there and every other load is absent")),
            Cases: r.Cases.Select((c, ci) => new ResultsCase(
                c.Id, c.IsCombination ? "combination" : "load case", c.Description,
                new ResultsCaseChecks(c.RelativeResidual, c.BackwardError, c.Equilibrium.RelativeForceError, c.Equilibrium.RelativeMomentError,
                    u.FromSI(c.Equilibrium.AppliedFx, Quantity.Force), u.FromSI(c.Equilibrium.AppliedFy, Quantity.Force),
                    u.FromSI(c.Equilibrium.ReactionFx, Quantity.Force), u.FromSI(c.Equilibrium.ReactionFy, Quantity.Force)),
                r.Model.Nodes.Select(n => new ResultsDisplacement(n.Id, u.FromSI(c.Displacement(n.Index, Dof.X), Quantity.Length),
                    u.FromSI(c.Displacement(n.Index, Dof.Y), Quantity.Length), c.Displacement(n.Index, Dof.RZ))),
                c.Reactions.Select(re => new ResultsReaction(r.Model.Nodes[re.Node].Id, u.FromSI(re.Fx, Quantity.Force), u.FromSI(re.Fy, Quantity.Force), u.FromSI(re.Mz, Quantity.Moment))),
                r.Panels.Count == 0 ? null : PanelBases(r, ci).Select(p => new ResultsPanelBase(p.Panel.Id, u.FromSI(p.Fx, Quantity.Force), u.FromSI(p.Fy, Quantity.Force),
                    u.FromSI(p.Mz, Quantity.Moment), u.FromSI(p.Panel.X0 + 0.5 * p.Panel.Length, Quantity.Length), u.FromSI(p.Panel.Y0, Quantity.Length))),
                c.MemberForces.Select(m => new ResultsMemberForces(r.Model.Members[m.Member].Id, u.FromSI(m.N1, Quantity.Force), u.FromSI(m.V1, Quantity.Force),
                    u.FromSI(m.M1, Quantity.Moment), u.FromSI(m.N2, Quantity.Force), u.FromSI(m.V2, Quantity.Force), u.FromSI(m.M2, Quantity.Moment))))));
    }
}
