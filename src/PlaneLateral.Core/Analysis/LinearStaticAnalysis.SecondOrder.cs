using PlaneLateral.Assembly;
using PlaneLateral.Elements;
using PlaneLateral.Model;
using PlaneLateral.Solvers;

namespace PlaneLateral.Analysis;

// The frame with its linked wall panels condensed onto their frame nodes, as the second-order (P-delta) analysis uses
// it: the elastic stiffness with the panels, extra element matrices (the members' geometric stiffness, the panels'
// story P-delta terms) added on top, the load vector of a case or combination with the panels' own loads moved onto
// their frame nodes, and the link forces recovered from a solution by the panels' exact condensed statics.
public static partial class LinearStaticAnalysis
{
    /// <summary>The frame with its linked panels condensed (the frame alone when no panel has links).</summary>
    internal sealed class CondensedFrame
    {
        private readonly LinkedPanels? _links;

        /// <summary>The condensation of a run's frame system (its elements, DOFs and linked panels), with <paramref name="model"/>'s loads.</summary>
        internal CondensedFrame(StructureModel model, FrameSystem system)
        {
            Model = model; Elements = system.Elements; Dofs = system.Dofs; _links = system.Links;
        }

        public StructureModel Model { get; }
        public FrameElement[] Elements { get; }
        public DofMap Dofs { get; }

        /// <summary>True when at least one panel is linked to the frame.</summary>
        public bool HasLinks => _links is not null;

        /// <summary>K of the members, springs and condensed panels, plus each extra element matrix on its equations (−1: held).</summary>
        public SymmetricSparseMatrix Stiffness(IEnumerable<(int[] Eqs, double[,] K)> extra)
        {
            var list = extra.ToList();
            var builder = new SymmetricMatrixBuilder(Dofs.FreeCount, 21 * Elements.Length + Dofs.FreeCount + list.Sum(x => x.Eqs.Length * x.Eqs.Length));
            AddFrame(builder, Model, Elements, Dofs);
            _links?.AddCondensed(builder, Dofs);
            foreach (var (eqs, k) in list) builder.AddElement(eqs, k);
            return builder.Build();
        }

        /// <summary>Load vector of a case or combination on the unknowns: the frame's loads, minus each linked panel's fixed-end forces.</summary>
        public double[] LoadVector(string caseId)
        {
            var f = GeometricStiffness.LoadVector(Model, Elements, Dofs, caseId);
            _links?.SubtractFixedEndForces(f, Dofs, Parts(caseId));
            return f;
        }

        /// <summary>
        /// For each link (panels in model order, links in file order): the panel, its frame node and the force and moment
        /// the link passes from the frame node to the panel (N, N·m; global axes, moment about the frame node), q = K_c·u_m + q_0
        /// (the condensed stiffness on the masters' motion plus the fixed-end forces of the panel's own loads).
        /// </summary>
        public IReadOnlyList<(WallPanel Panel, int Node, double Fx, double Fy, double Mz)> LinkForces(double[] u, string caseId) =>
            _links?.LinkForces(u, Dofs, Parts(caseId)) ?? [];

        private IReadOnlyList<(int Case, double Factor)> Parts(string id)
        {
            int i = Model.LoadCases.ToList().FindIndex(c => c.Id == id);
            if (i >= 0) return [(i, 1.0)];
            return Model.Combinations.First(c => c.Id == id).Factors;
        }
    }

    internal sealed partial class LinkedPanels
    {
        public void AddCondensed(SymmetricMatrixBuilder builder, DofMap dofs)
        {
            foreach (var p in _panels) builder.AddElement(MasterEquations(p, dofs), p.Condensed.Stiffness);
        }

        public void SubtractFixedEndForces(double[] f, DofMap dofs, IReadOnlyList<(int Case, double Factor)> parts)
        {
            foreach (var p in _panels)
            {
                var eqs = MasterEquations(p, dofs);
                foreach (var (c, fac) in parts)
                    for (int j = 0; j < eqs.Length; j++)
                        if (eqs[j] >= 0) f[eqs[j]] -= fac * p.Condensed.FixedEndForces[c][j];
            }
        }

        public IReadOnlyList<(WallPanel Panel, int Node, double Fx, double Fy, double Mz)> LinkForces(double[] u, DofMap dofs, IReadOnlyList<(int Case, double Factor)> parts)
        {
            var list = new List<(WallPanel, int, double, double, double)>();
            foreach (var p in _panels)
            {
                var eqs = MasterEquations(p, dofs);
                int m = eqs.Length;
                var q = new double[m];
                for (int i = 0; i < m; i++)
                {
                    for (int j = 0; j < m; j++) if (eqs[j] >= 0) q[i] += p.Condensed.Stiffness[i, j] * u[eqs[j]];
                    foreach (var (c, fac) in parts) q[i] += fac * p.Condensed.FixedEndForces[c][i];
                }
                for (int s = 0; s < p.Masters.Length; s++) list.Add((p.Panel, p.Masters[s], q[3 * s], q[3 * s + 1], q[3 * s + 2]));
            }
            return list;
        }
    }
}
