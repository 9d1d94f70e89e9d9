using MathNet.Numerics.LinearAlgebra;
using PlaneLateral.Solvers;

namespace PlaneLateral.Tests.Solvers;

/// <summary>
/// Seeded generators of sparse symmetric test matrices, and dense reference operations.
/// Everything is assembled through <see cref="SymmetricMatrixBuilder"/>, as the FE assembly will do.
/// </summary>
internal static class TestMatrices
{
    /// <summary>Adds a two-node spring [w −w; −w w] between DOFs i and j (a graph-Laplacian edge).</summary>
    public static void AddSpring(SymmetricMatrixBuilder b, int i, int j, double w) =>
        b.AddElement(new[] { i, j }, new[,] { { w, -w }, { -w, w } });

    /// <summary>
    /// Weighted Laplacian of a random graph on n nodes (about <paramref name="edgesPerNode"/>·n edges, weights in [0.5, 2])
    /// plus a diagonal shift drawn from [shiftMin, shiftMin + 1) at every node: SPD when shiftMin &gt; 0.
    /// With <paramref name="shiftMin"/> &lt; 0 and <paramref name="shift"/> false the Laplacian alone is returned.
    /// </summary>
    public static SymmetricSparseMatrix RandomLaplacianPlusDiagonal(int n, int seed, double edgesPerNode = 2.0, double shiftMin = 0.05, bool shift = true)
    {
        var rng = new Random(seed);
        var b = new SymmetricMatrixBuilder(n);
        int edges = (int)(edgesPerNode * n);
        for (int e = 0; e < edges && n > 1; e++)
        {
            int i = rng.Next(n), j = rng.Next(n);
            if (i == j) continue;
            AddSpring(b, i, j, 0.5 + 1.5 * rng.NextDouble());
        }
        for (int i = 0; i < n; i++)
        {
            if (shift) b.AddDiagonal(i, shiftMin + rng.NextDouble());
            else b.AddDiagonal(i, 0.0); // keeps the diagonal entry stored even for a node without springs
        }
        return b.Build();
    }

    /// <summary>A random permutation p[k] (Fisher–Yates, seeded).</summary>
    public static int[] RandomPermutation(int n, int seed)
    {
        var rng = new Random(seed);
        var p = new int[n];
        for (int i = 0; i < n; i++) p[i] = i;
        for (int i = n - 1; i > 0; i--)
        {
            int j = rng.Next(i + 1);
            (p[i], p[j]) = (p[j], p[i]);
        }
        return p;
    }

    /// <summary>
    /// 5-point (2D) or 7-point (3D) Laplacian stencil on an nx×ny×nz grid with a diagonal shift (SPD), node (x,y,z)
    /// numbered label[x + nx·(y + ny·z)] where label is a seeded random permutation (seed &lt; 0: natural numbering).
    /// </summary>
    public static SymmetricSparseMatrix GridStencil(int nx, int ny, int nz, int scrambleSeed, double shift = 0.1, int weightJitterSeed = -1)
    {
        int n = nx * ny * nz;
        var label = scrambleSeed >= 0 ? RandomPermutation(n, scrambleSeed) : Orderings.Natural(n);
        var rng = weightJitterSeed >= 0 ? new Random(weightJitterSeed) : null;
        var b = new SymmetricMatrixBuilder(n);
        int Id(int x, int y, int z) => label[x + nx * (y + ny * z)];
        double W() => rng is null ? 1.0 : 0.5 + rng.NextDouble();
        for (int z = 0; z < nz; z++)
            for (int y = 0; y < ny; y++)
                for (int x = 0; x < nx; x++)
                {
                    if (x + 1 < nx) AddSpring(b, Id(x, y, z), Id(x + 1, y, z), W());
                    if (y + 1 < ny) AddSpring(b, Id(x, y, z), Id(x, y + 1, z), W());
                    if (z + 1 < nz) AddSpring(b, Id(x, y, z), Id(x, y, z + 1), W());
                    b.AddDiagonal(Id(x, y, z), shift);
                }
        return b.Build();
    }

    /// <summary>
    /// An nx×ny node grid of 4-node cells, each coupling all its corners (a complete-graph Laplacian per cell, like the
    /// sparsity of bilinear quadrilaterals: 8 neighbours per node), plus a diagonal shift; numbering scrambled by a seeded
    /// permutation (seed &lt; 0: row by row).
    /// </summary>
    public static SymmetricSparseMatrix QuadCellGrid(int nx, int ny, int scrambleSeed, double shift = 0.1)
    {
        int n = nx * ny;
        var label = scrambleSeed >= 0 ? RandomPermutation(n, scrambleSeed) : Orderings.Natural(n);
        var b = new SymmetricMatrixBuilder(n);
        for (int y = 0; y + 1 < ny; y++)
            for (int x = 0; x + 1 < nx; x++)
            {
                int n0 = x + nx * y;
                int[] c = { label[n0], label[n0 + 1], label[n0 + nx], label[n0 + nx + 1] };
                for (int i = 0; i < 4; i++)
                    for (int j = 0; j < i; j++) AddSpring(b, c[i], c[j], 1.0);
            }
        for (int i = 0; i < n; i++) b.AddDiagonal(i, shift);
        return b.Build();
    }

    /// <summary>Dense MathNet matrix of the full symmetric matrix.</summary>
    public static Matrix<double> Dense(SymmetricSparseMatrix a) => Matrix<double>.Build.DenseOfArray(a.ToDense());

    public static double[] RandomVector(int n, int seed)
    {
        var rng = new Random(seed);
        var v = new double[n];
        for (int i = 0; i < n; i++) v[i] = 2.0 * rng.NextDouble() - 1.0;
        return v;
    }

    public static double Norm(ReadOnlySpan<double> v)
    {
        double s = 0;
        foreach (double x in v) s += x * x;
        return Math.Sqrt(s);
    }

    /// <summary>‖K·x − b‖₂.</summary>
    public static double ResidualNorm(SymmetricSparseMatrix a, double[] x, double[] b)
    {
        var y = new double[a.Size];
        a.Multiply(x, y);
        for (int i = 0; i < y.Length; i++) y[i] -= b[i];
        return Norm(y);
    }

    /// <summary>Frobenius norm of the full matrix (an upper bound of the 2-norm, enough for relative checks).</summary>
    public static double FrobeniusNorm(SymmetricSparseMatrix a)
    {
        double s = 0;
        for (int j = 0; j < a.Size; j++)
            for (int p = a.ColumnPointers[j]; p < a.ColumnPointers[j + 1]; p++)
                s += (a.RowIndices[p] == j ? 1.0 : 2.0) * a.Values[p] * a.Values[p];
        return Math.Sqrt(s);
    }

    public static double RelativeDifference(double[] x, double[] y)
    {
        double num = 0, den = 0;
        for (int i = 0; i < x.Length; i++)
        {
            num += (x[i] - y[i]) * (x[i] - y[i]);
            den += y[i] * y[i];
        }
        return den == 0 ? Math.Sqrt(num) : Math.Sqrt(num / den);
    }
}

/// <summary>More generators: 2-DOF-per-node grids (the sparsity of plane-stress meshes) and dense SPD matrices.</summary>
internal static class MoreTestMatrices
{
    /// <summary>
    /// nx×ny nodes, 2 DOFs each, 4-node cells coupling all corners (8 neighbours per node) with the SPD 2×2 block
    /// [[2, 1], [1, 2]] ⊗ (cell Laplacian), plus a diagonal shift; DOF numbering scrambled by a seeded permutation
    /// (seed &lt; 0: node by node, row by row).
    /// </summary>
    public static SymmetricSparseMatrix TwoDofQuadGrid(int nx, int ny, int scrambleSeed, double shift = 0.05)
    {
        int n = 2 * nx * ny;
        var label = scrambleSeed >= 0 ? TestMatrices.RandomPermutation(n, scrambleSeed) : Orderings.Natural(n);
        var b = new SymmetricMatrixBuilder(n);
        var ke = new double[4, 4];
        for (int y = 0; y + 1 < ny; y++)
            for (int x = 0; x + 1 < nx; x++)
            {
                int n0 = x + nx * y;
                int[] c = { n0, n0 + 1, n0 + nx, n0 + nx + 1 };
                for (int i = 0; i < 4; i++)
                    for (int j = 0; j < i; j++)
                    {
                        // 2×2 block coupling of nodes c[i], c[j]: [B −B; −B B] with B = [[2,1],[1,2]].
                        int[] d = { label[2 * c[i]], label[2 * c[i] + 1], label[2 * c[j]], label[2 * c[j] + 1] };
                        double[,] blk = { { 2, 1 }, { 1, 2 } };
                        for (int p = 0; p < 2; p++)
                            for (int q = 0; q < 2; q++)
                            {
                                ke[p, q] = blk[p, q];
                                ke[p + 2, q + 2] = blk[p, q];
                                ke[p, q + 2] = -blk[p, q];
                                ke[p + 2, q] = -blk[p, q];
                            }
                        b.AddElement(d, ke);
                    }
            }
        for (int i = 0; i < n; i++) b.AddDiagonal(i, shift);
        return b.Build();
    }

    /// <summary>A dense SPD matrix G·Gᵀ/n + I (seeded), stored as a sparse matrix.</summary>
    public static SymmetricSparseMatrix DenseSpd(int n, int seed)
    {
        var rng = new Random(seed);
        var g = new double[n, n];
        for (int i = 0; i < n; i++)
            for (int j = 0; j < n; j++) g[i, j] = 2 * rng.NextDouble() - 1;
        var b = new SymmetricMatrixBuilder(n);
        for (int i = 0; i < n; i++)
            for (int j = 0; j <= i; j++)
            {
                double s = 0;
                for (int k = 0; k < n; k++) s += g[i, k] * g[j, k];
                s /= n;
                if (i == j) s += 1.0;
                if (i == j) b.AddDiagonal(i, s);
                else b.AddElement(new[] { i, j }, new[,] { { 0.0, s }, { s, 0.0 } });
            }
        return b.Build();
    }

    /// <summary>
    /// nnz(L) (diagonal included) of the Cholesky factor of P·K·Pᵀ by simulating the elimination on a dense boolean
    /// matrix (George and Liu 1981, §2.2: eliminating node k connects all its later neighbours). O(n³): small n only.
    /// </summary>
    public static long SymbolicFillByElimination(SymmetricSparseMatrix a, int[] perm) => ColumnCountsByElimination(a, perm).Sum(c => (long)c);

    /// <summary>Entries of each column of L (diagonal included) of P·A·Pᵀ, by elimination on a dense boolean matrix (derived).</summary>
    public static int[] ColumnCountsByElimination(SymmetricSparseMatrix a, int[] perm)
    {
        int n = a.Size;
        var inv = Orderings.Inverse(perm);
        var s = new bool[n, n];
        for (int j = 0; j < n; j++)
            for (int p = a.ColumnPointers[j]; p < a.ColumnPointers[j + 1]; p++)
            {
                int r = inv[a.RowIndices[p]], c = inv[j];
                s[r, c] = s[c, r] = true;
            }
        var count = new int[n];
        for (int k = 0; k < n; k++)
        {
            var below = new List<int>();
            for (int i = k + 1; i < n; i++) if (s[i, k]) below.Add(i);
            count[k] = 1 + below.Count;
            foreach (int i in below)
                foreach (int j in below) s[i, j] = true;
        }
        return count;
    }
}
