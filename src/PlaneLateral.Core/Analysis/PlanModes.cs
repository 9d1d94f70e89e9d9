using PlaneLateral.Elements;
using PlaneLateral.Model;

namespace PlaneLateral.Analysis;

/// <summary>
/// One vibration mode of a building in plan (three DOFs per floor).
/// </summary>
/// <param name="Shape">Mass-normalised shape about the plan origin: (Ux, Uy, Rz) per floor, lowest first (φᵀMφ = 1; m·√kg⁻¹, rad·√kg⁻¹).</param>
/// <param name="Participation">Γ = φᵀMι / φᵀMφ for ι = unit motion along X, along Y, and a unit turn about <see cref="PlanModal.Pivot"/>.</param>
/// <param name="EffectiveMass">(φᵀMι)² / φᵀMφ for the three ι (kg, kg, kg·m²).</param>
/// <param name="Share">Effective mass over the total (ιᵀMι) for the three ι.</param>
/// <param name="Cumulative">Σ of <see cref="Share"/> over this mode and the longer ones.</param>
/// <param name="Dominant">"x", "y" or "torsion": the largest share.</param>
public sealed record PlanMode(int Number, double Period, double Omega, double[] Shape, double[] Participation, double[] EffectiveMass, double[] Share, double[] Cumulative, string Dominant)
{
    /// <summary>The shape at a floor's centre of mass (Ux, Uy there and Rz), scaled so that the largest of |Ux|, |Uy| and
    /// |Rz|·(plan size / 2) over all floors is 1, signed so that the largest is positive (for tables).</summary>
    public (double Ux, double Uy, double Rz)[] Display(BuildingPlan plan)
    {
        int n = plan.FloorCount;
        var rows = new (double, double, double)[n];
        double big = 0, signed = 0, half = plan.Size / 2;
        for (int l = 0; l < n; l++)
        {
            var c = plan.Levels[l + 1].CentreOfMass;
            double rz = Shape[3 * l + 2], ux = Shape[3 * l] - rz * c.Y, uy = Shape[3 * l + 1] + rz * c.X;
            rows[l] = (ux, uy, rz);
            foreach (double v in new[] { ux, uy, rz * half })
                if (Math.Abs(v) > big) { big = Math.Abs(v); signed = v; }
        }
        if (signed == 0) return rows;
        return rows.Select(r => (r.Item1 / signed, r.Item2 / signed, r.Item3 / signed)).ToArray();
    }
}

/// <summary>
/// The floor masses of a building in plan and the modes of K·φ = ω²·M·φ on the floors' (Ux, Uy, Rz) about the plan
/// origin. A floor of mass m with its centre of mass at (x_c, y_c) and mass moment of inertia J about it has the mass
/// matrix m·[[1, 0, −y_c], [0, 1, x_c], [−y_c, x_c, x_c² + y_c²]] + diag(0, 0, J) (Chopra, <i>Dynamics of Structures</i>,
/// unsymmetric-plan buildings — standard). The eigenproblem is solved in centre-of-mass coordinates q = (Ux_c, Uy_c, Rz),
/// where M = diag(m, m, J): with u = A·q, K_q = AᵀKA, and D^{−½}·K_q·D^{−½}·ψ = ω²·ψ solved by
/// <see cref="SymmetricEigen.Solve"/> (all 3·floors modes).
/// </summary>
public sealed class PlanModal
{
    public required BuildingPlan Plan { get; init; }
    /// <summary>The floor stiffness about the origin (N/m, N, N·m/rad).</summary>
    public required double[,] Stiffness { get; init; }
    /// <summary>The mass matrix about the origin, block-diagonal (kg, kg·m, kg·m²).</summary>
    public required double[,] Mass { get; init; }
    /// <summary>Every mode, longest period first.</summary>
    public required IReadOnlyList<PlanMode> Modes { get; init; }
    /// <summary>ιᵀMι for X, Y and the turn about <see cref="Pivot"/> (kg, kg, kg·m²).</summary>
    public required double[] TotalMass { get; init; }
    /// <summary>The building's centre of mass in plan (mass-weighted mean of the floors'): the pivot of the rotational ι.</summary>
    public required PlanPoint Pivot { get; init; }

    /// <summary>The influence vector ι (3 per floor, about the origin) of a unit ground motion: 0 along X, 1 along Y, 2 a unit turn about <see cref="Pivot"/>.</summary>
    public double[] Influence(int direction)
    {
        int n = Plan.FloorCount;
        var v = new double[3 * n];
        for (int l = 0; l < n; l++)
        {
            if (direction == 0) v[3 * l] = 1;
            else if (direction == 1) v[3 * l + 1] = 1;
            else { v[3 * l] = Pivot.Y; v[3 * l + 1] = -Pivot.X; v[3 * l + 2] = 1; }
        }
        return v;
    }

    /// <summary>The fewest modes (longest first) whose cumulative effective mass reaches <paramref name="share"/> in
    /// each of <paramref name="directions"/> (0 = X, 1 = Y); all modes when even they fall short.</summary>
    public int ModesFor(double share, params int[] directions)
    {
        for (int k = 0; k < Modes.Count; k++)
            if (directions.All(d => Modes[k].Cumulative[d] >= share - 1e-12)) return k + 1;
        return Modes.Count;
    }

    /// <summary>The floor mass matrix about the origin, 3 per floor (kg, kg·m, kg·m²).</summary>
    /// <exception cref="ModelInputException">A floor has no weight (the "weight" key of its level).</exception>
    public static double[,] MassMatrix(BuildingPlan plan)
    {
        int n = plan.FloorCount;
        var missing = plan.Levels.Skip(1).Where(l => !(l.Weight > 0) || !(l.PolarInertia > 0)).ToList();
        if (missing.Count > 0)
            throw new ModelInputException(missing.Select(l => new ModelDiagnostic(plan.SourcePath, 0, 0, $"$.plan.levels[id={l.Id}].weight",
                $"level \"{l.Id}\" has no seismic weight, so the floor has no mass for the periods and seismic forces",
                "give every floor level its \"weight\" (and, for an unusual mass layout, \"polarInertia\")")).ToList());
        var m = new double[3 * n, 3 * n];
        for (int l = 0; l < n; l++)
        {
            var lv = plan.Levels[l + 1];
            double mass = lv.Weight / SeismicPresets.Gravity, x = lv.CentreOfMass.X, y = lv.CentreOfMass.Y;
            int o = 3 * l;
            m[o, o] = mass; m[o + 1, o + 1] = mass;
            m[o, o + 2] = m[o + 2, o] = -mass * y;
            m[o + 1, o + 2] = m[o + 2, o + 1] = mass * x;
            m[o + 2, o + 2] = lv.PolarInertia + mass * (x * x + y * y);
        }
        return m;
    }

    /// <summary>The modes of the floor system K (about the origin, as <see cref="PlanAnalysis.Assemble"/> gives it).</summary>
    /// <exception cref="ModelInputException">A floor has no weight.</exception>
    public static PlanModal Solve(BuildingPlan plan, double[,] k)
    {
        int n = plan.FloorCount, size = 3 * n;
        var mass = MassMatrix(plan);
        // q = (Ux_c, Uy_c, Rz) per floor; u = A q with Ux = Ux_c + y_c·Rz, Uy = Uy_c − x_c·Rz.
        var d = new double[size];
        for (int l = 0; l < n; l++)
        {
            var lv = plan.Levels[l + 1];
            d[3 * l] = d[3 * l + 1] = lv.Weight / SeismicPresets.Gravity;
            d[3 * l + 2] = lv.PolarInertia;
        }
        double[,] a = new double[size, size];   // A
        for (int l = 0; l < n; l++)
        {
            var c = plan.Levels[l + 1].CentreOfMass;
            int o = 3 * l;
            a[o, o] = 1; a[o + 1, o + 1] = 1; a[o + 2, o + 2] = 1;
            a[o, o + 2] = c.Y; a[o + 1, o + 2] = -c.X;
        }
        var kq = new double[size, size];
        var ka = new double[size, size];
        for (int i = 0; i < size; i++)
            for (int j = 0; j < size; j++)
            {
                double s = 0;
                for (int t = 0; t < size; t++) s += k[i, t] * a[t, j];
                ka[i, j] = s;
            }
        for (int i = 0; i < size; i++)
            for (int j = 0; j < size; j++)
            {
                double s = 0;
                for (int t = 0; t < size; t++) s += a[t, i] * ka[t, j];
                kq[i, j] = s;
            }
        var sym = new double[size, size];
        for (int i = 0; i < size; i++)
            for (int j = 0; j < size; j++)
                sym[i, j] = 0.5 * (kq[i, j] + kq[j, i]) / Math.Sqrt(d[i] * d[j]);
        var (values, vectors) = SymmetricEigen.Solve(sym);

        double mt = plan.Levels.Skip(1).Sum(l => l.Weight / SeismicPresets.Gravity);
        var pivot = new PlanPoint(plan.Levels.Skip(1).Sum(l => l.Weight / SeismicPresets.Gravity * l.CentreOfMass.X) / mt,
            plan.Levels.Skip(1).Sum(l => l.Weight / SeismicPresets.Gravity * l.CentreOfMass.Y) / mt);
        var modal = new PlanModal { Plan = plan, Stiffness = (double[,])k.Clone(), Mass = mass, Modes = [], TotalMass = [], Pivot = pivot };
        var iota = Enumerable.Range(0, 3).Select(modal.Influence).ToArray();
        var mi = iota.Select(v => SmallMatrix.Times(mass, v)).ToArray();
        var total = Enumerable.Range(0, 3).Select(r => SmallMatrix.Dot(iota[r], mi[r])).ToArray();

        var modes = new List<PlanMode>();
        var cumulative = new double[3];
        for (int m = size - 1; m >= 0; m--)   // eigenvalues come largest first: the longest period is the last
        {
            double w2 = values[m];
            if (!(w2 > 0)) continue;
            var q = new double[size];
            for (int i = 0; i < size; i++) q[i] = vectors[i, m] / Math.Sqrt(d[i]);
            var phi = SmallMatrix.Times(a, q);   // φᵀMφ = ψᵀψ = 1
            double mn = SmallMatrix.Dot(phi, SmallMatrix.Times(mass, phi));
            var gamma = new double[3];
            var eff = new double[3];
            var share = new double[3];
            for (int r = 0; r < 3; r++)
            {
                double ln = SmallMatrix.Dot(phi, mi[r]);
                gamma[r] = ln / mn;
                eff[r] = ln * ln / mn;
                share[r] = total[r] > 0 ? eff[r] / total[r] : 0;
                cumulative[r] += share[r];
            }
            string dominant = share[0] >= share[1] && share[0] >= share[2] ? "x" : share[1] >= share[2] ? "y" : "torsion";
            double omega = Math.Sqrt(w2);
            modes.Add(new PlanMode(modes.Count + 1, 2 * Math.PI / omega, omega, phi, gamma, eff, share, (double[])cumulative.Clone(), dominant));
        }
        return new PlanModal { Plan = plan, Stiffness = modal.Stiffness, Mass = mass, Modes = modes, TotalMass = total, Pivot = pivot };
    }

    /// <summary>The modes of a building: its lines condensed and assembled (<see cref="PlanAnalysis.Condense"/>, <see cref="PlanAnalysis.Assemble"/>).</summary>
    public static PlanModal Solve(BuildingPlan plan, AnalysisOptions? options = null)
    {
        var condensed = plan.Lines.Select(l => PlanAnalysis.Condense(l, plan.FloorCount, options).K).ToList();
        return Solve(plan, PlanAnalysis.Assemble(plan.Lines, condensed, plan.FloorCount));
    }
}
