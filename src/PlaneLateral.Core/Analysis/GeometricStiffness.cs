using PlaneLateral.Assembly;
using PlaneLateral.Elements;
using PlaneLateral.Model;
using PlaneLateral.Solvers;

namespace PlaneLateral.Analysis;

/// <summary>
/// Geometric stiffness of the members under their axial forces, and the gravity-case solve that gives those forces.
/// <para>
/// A beam-column with no release: the consistent geometric stiffness of the cubic (Euler–Bernoulli) shape over the
/// flexible length L_f, per unit axial tension N, on (v1, θ1, v2, θ2): N/(30L_f)·[36, 3L_f, −36, 3L_f; 3L_f, 4L_f², −3L_f,
/// −L_f²; −36, −3L_f, 36, −3L_f; 3L_f, −L_f², −3L_f, 4L_f²] (e.g. McGuire, Gallagher &amp; Ziemian, <i>Matrix Structural
/// Analysis</i>, 2nd ed., 2000, ch. 9 — common practice). It leaves out the shear flexibility, which lowers the
/// critical load of squat members a little. A brace or a member with a release: the string term N/L_f on the
/// transverse translations only (P-Δ of the chord). Both are carried through the rigid-zone offsets and the rotation
/// like the elastic stiffness. Compression (N &lt; 0) softens.
/// </para>
/// </summary>
public static class GeometricStiffness
{
    /// <summary>Global 6×6 geometric stiffness of <paramref name="e"/> under axial tension <paramref name="n"/> (N; negative in compression).</summary>
    public static double[,] Global(FrameElement e, double n)
    {
        double l = e.FlexibleLength;
        var g = new double[6, 6];
        bool consistent = e.Member.Kind == MemberKind.BeamColumn && !e.Member.ReleaseStart && !e.Member.ReleaseEnd;
        int[] idx = [1, 2, 4, 5];
        if (consistent)
        {
            double[,] b =
            {
                { 36, 3 * l, -36, 3 * l },
                { 3 * l, 4 * l * l, -3 * l, -l * l },
                { -36, -3 * l, 36, -3 * l },
                { 3 * l, -l * l, -3 * l, 4 * l * l },
            };
            for (int i = 0; i < 4; i++)
                for (int j = 0; j < 4; j++) g[idx[i], idx[j]] = n / (30 * l) * b[i, j];
        }
        else
        {
            g[1, 1] = g[4, 4] = n / l;
            g[1, 4] = g[4, 1] = -n / l;
        }
        var offset = new double[6, 6];
        for (int i = 0; i < 6; i++) offset[i, i] = 1;
        offset[1, 2] = e.Member.RigidStart;
        offset[4, 5] = -e.Member.RigidEnd;
        var rot = new double[6, 6];
        for (int k = 0; k < 2; k++)
        {
            int o = 3 * k;
            rot[o, o] = e.Cos; rot[o, o + 1] = e.Sin;
            rot[o + 1, o] = -e.Sin; rot[o + 1, o + 1] = e.Cos;
            rot[o + 2, o + 2] = 1;
        }
        return SmallMatrix.Congruent(SmallMatrix.Congruent(g, offset), rot);
    }

    /// <summary>The member loads of a case or combination (factored), by member.</summary>
    public static IReadOnlyList<MemberLoad>[] MemberLoads(StructureModel model, string caseId)
    {
        var lists = model.Members.Select(_ => new List<MemberLoad>()).ToArray();
        foreach (var (lc, f) in Parts(model, caseId))
            foreach (var ml in lc.MemberLoads) lists[ml.Member].Add(ml with { WStart = f * ml.WStart, WEnd = f * ml.WEnd });
        return lists.Select(l => (IReadOnlyList<MemberLoad>)l).ToArray();
    }

    /// <summary>The load vector on the unknowns of a load case or combination (nodal loads and member loads).</summary>
    public static double[] LoadVector(StructureModel model, IReadOnlyList<FrameElement> elements, DofMap dofs, string caseId)
    {
        var f = new double[dofs.FreeCount];
        void At(int eq, double v) { if (eq >= 0) f[eq] += v; }
        foreach (var (lc, fac) in Parts(model, caseId))
            foreach (var nl in lc.NodalLoads)
            {
                At(dofs.Equation(nl.Node, Dof.X), fac * nl.Fx);
                At(dofs.Equation(nl.Node, Dof.Y), fac * nl.Fy);
                At(dofs.Equation(nl.Node, Dof.RZ), fac * nl.Mz);
            }
        var loads = MemberLoads(model, caseId);
        for (int m = 0; m < elements.Count; m++)
        {
            if (loads[m].Count == 0) continue;
            var fe = elements[m].GlobalEquivalentLoads(loads[m]);
            var eqs = dofs.ElementEquations(elements[m].Member);
            for (int d = 0; d < 6; d++) At(eqs[d], fe[d]);
        }
        return f;
    }

    private static IEnumerable<(LoadCase Case, double Factor)> Parts(StructureModel model, string id)
    {
        var lc = model.LoadCases.FirstOrDefault(c => c.Id == id);
        if (lc is not null) return [(lc, 1.0)];
        var combo = model.Combinations.First(c => c.Id == id);
        return combo.Factors.Select(p => (model.LoadCases[p.Case], p.Factor));
    }

    /// <summary>Axial tension (N, negative in compression) of every member's flexible segment under a case, solved on <paramref name="factor"/>.</summary>
    public static double[] AxialForces(StructureModel model, IReadOnlyList<FrameElement> elements, DofMap dofs, ISparseSpdFactor factor, string caseId)
    {
        var f = LoadVector(model, elements, dofs, caseId);
        var u = new double[dofs.FreeCount];
        factor.Solve(f, u);
        return AxialForces(model, elements, dofs, u, caseId);
    }

    /// <summary>Axial tension (N, negative in compression) of every member's flexible segment from the solution <paramref name="u"/> of a case.</summary>
    public static double[] AxialForces(StructureModel model, IReadOnlyList<FrameElement> elements, DofMap dofs, double[] u, string caseId)
    {
        var loads = MemberLoads(model, caseId);
        var n = new double[elements.Count];
        for (int m = 0; m < elements.Count; m++)
        {
            var e = elements[m];
            var ue = new double[6];
            var eqs = dofs.ElementEquations(e.Member);
            for (int d = 0; d < 6; d++) ue[d] = eqs[d] >= 0 ? u[eqs[d]] : 0;
            n[m] = e.LocalEndForces(ue, loads[m])[3];   // N2: tension positive at the end face
        }
        return n;
    }

    /// <summary>K + λ·K_G(N) on the unknowns (elastic stiffness, support springs, geometric stiffness scaled by λ).</summary>
    public static SymmetricSparseMatrix Assemble(StructureModel model, IReadOnlyList<FrameElement> elements, DofMap dofs, double[] axial, double lambda = 1.0)
    {
        var builder = new SymmetricMatrixBuilder(dofs.FreeCount, 42 * elements.Count + dofs.FreeCount);
        foreach (var e in elements)
        {
            var k = (double[,])e.GlobalStiffness.Clone();
            var g = Global(e, lambda * axial[e.Member.Index]);
            for (int i = 0; i < 6; i++) for (int j = 0; j < 6; j++) k[i, j] += g[i, j];
            builder.AddElement(dofs.ElementEquations(e.Member), k);
        }
        foreach (var s in model.Supports)
            for (int d = 0; d < 3; d++)
            {
                double ks = s.Spring((Dof)d);
                int eq = dofs.Equation(s.Node, (Dof)d);
                if (ks > 0 && eq >= 0) builder.AddDiagonal(eq, ks);
            }
        return builder.Build();
    }
}
