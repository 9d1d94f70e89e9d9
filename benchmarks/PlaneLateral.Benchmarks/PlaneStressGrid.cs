using PlaneLateral.Solvers;

namespace PlaneLateral.Benchmarks;

/// <summary>
/// A plane-stress-like test matrix: an nx×ny grid of nodes (2 DOFs each) joined by 4-node bilinear quadrilaterals, so every
/// node couples to its 8 neighbours. The nodes on the edge x = 0 are fixed (both DOFs restrained), which makes the matrix SPD.
/// Element stiffness: the textbook isoparametric bilinear quadrilateral with 2×2 Gauss integration
/// (Cook, Malkus, Plesha and Witt, "Concepts and Applications of Finite Element Analysis", 4th ed., 2002, ch. 6),
/// unit square, E = 1, ν = 0.3, unit thickness.
/// </summary>
public static class PlaneStressGrid
{
    /// <summary>Free-DOF numbering of the grid.</summary>
    public enum Numbering
    {
        /// <summary>Nodes row by row along the longer side (x fastest), the two DOFs of a node adjacent.</summary>
        RowByRow,
        /// <summary>Free DOFs numbered by a seeded random permutation (a worst case for the natural order).</summary>
        Scrambled,
    }

    public static SymmetricSparseMatrix Build(int nx, int ny, Numbering numbering = Numbering.RowByRow, int seed = 1)
    {
        int nodes = nx * ny;
        var dof = new int[2 * nodes];
        int free = 0;
        for (int y = 0; y < ny; y++)
            for (int x = 0; x < nx; x++)
            {
                int node = x + nx * y;
                bool fixedNode = x == 0;
                dof[2 * node] = fixedNode ? -1 : free++;
                dof[2 * node + 1] = fixedNode ? -1 : free++;
            }
        if (numbering == Numbering.Scrambled)
        {
            var rng = new Random(seed);
            var p = new int[free];
            for (int i = 0; i < free; i++) p[i] = i;
            for (int i = free - 1; i > 0; i--) { int j = rng.Next(i + 1); (p[i], p[j]) = (p[j], p[i]); }
            for (int k = 0; k < dof.Length; k++) if (dof[k] >= 0) dof[k] = p[dof[k]];
        }

        var ke = QuadStiffness(1.0, 0.3);
        var b = new SymmetricMatrixBuilder(free, capacityHint: (nx - 1) * (ny - 1) * 36);
        var dofs = new int[8];
        for (int y = 0; y + 1 < ny; y++)
            for (int x = 0; x + 1 < nx; x++)
            {
                // Corner nodes counter-clockwise from (x, y).
                int n0 = x + nx * y, n1 = n0 + 1, n2 = n1 + nx, n3 = n0 + nx;
                int[] corner = { n0, n1, n2, n3 };
                for (int c = 0; c < 4; c++) { dofs[2 * c] = dof[2 * corner[c]]; dofs[2 * c + 1] = dof[2 * corner[c] + 1]; }
                b.AddElement(dofs, ke);
            }
        return b.Build();
    }

    /// <summary>8×8 stiffness of a unit-square bilinear plane-stress quadrilateral, DOFs (u0, v0, u1, v1, …).</summary>
    public static double[,] QuadStiffness(double e, double nu)
    {
        double c = e / (1 - nu * nu);
        var d = new[,] { { c, c * nu, 0 }, { c * nu, c, 0 }, { 0, 0, c * (1 - nu) / 2 } };
        double[] xi = { -1, 1, 1, -1 }, eta = { -1, -1, 1, 1 };
        double g = 1 / Math.Sqrt(3);
        var k = new double[8, 8];
        foreach (double gx in new[] { -g, g })
            foreach (double gy in new[] { -g, g })
            {
                // Unit square: x = (1 + ξ)/2, so ∂N/∂x = 2·∂N/∂ξ and det J = 1/4.
                var bm = new double[3, 8];
                for (int a = 0; a < 4; a++)
                {
                    double dnx = 2 * 0.25 * xi[a] * (1 + eta[a] * gy);
                    double dny = 2 * 0.25 * eta[a] * (1 + xi[a] * gx);
                    bm[0, 2 * a] = dnx;
                    bm[1, 2 * a + 1] = dny;
                    bm[2, 2 * a] = dny;
                    bm[2, 2 * a + 1] = dnx;
                }
                for (int r = 0; r < 8; r++)
                    for (int s = 0; s < 8; s++)
                    {
                        double sum = 0;
                        for (int p = 0; p < 3; p++)
                            for (int q = 0; q < 3; q++) sum += bm[p, r] * d[p, q] * bm[q, s];
                        k[r, s] += sum * 0.25;
                    }
            }
        return k;
    }
}
