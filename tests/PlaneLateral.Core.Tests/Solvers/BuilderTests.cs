using System.Globalization;
using PlaneLateral.Solvers;
using static PlaneLateral.Tests.Solvers.TestMatrices;

namespace PlaneLateral.Tests.Solvers;

/// <summary>
/// The triplet builder and the compressed symmetric matrix. Each check compares with a dense matrix assembled
/// independently in the test ("direct stiffness" summation, common practice).
/// </summary>
public class BuilderTests
{
    private static void AssertStorageInvariants(SymmetricSparseMatrix a)
    {
        // The documented layout: lower triangle, rows strictly ascending within each column, diagonal first when present.
        Assert.Equal(a.Size + 1, a.ColumnPointers.Length);
        Assert.Equal(0, a.ColumnPointers[0]);
        for (int j = 0; j < a.Size; j++)
        {
            Assert.True(a.ColumnPointers[j] <= a.ColumnPointers[j + 1]);
            for (int p = a.ColumnPointers[j]; p < a.ColumnPointers[j + 1]; p++)
            {
                Assert.True(a.RowIndices[p] >= j);
                if (p > a.ColumnPointers[j]) Assert.True(a.RowIndices[p] > a.RowIndices[p - 1]);
            }
        }
        Assert.Equal(a.NonZerosLower, a.RowIndices.Length);
    }

    [Fact]
    public void DuplicatesAreSummed()
    {
        var b = new SymmetricMatrixBuilder(3);
        var ke = new[,] { { 2.0, -1.0 }, { -1.0, 2.0 } };
        b.AddElement(new[] { 0, 2 }, ke);
        b.AddElement(new[] { 2, 0 }, ke);   // the same pair in the other order
        b.AddDiagonal(1, 1.5);
        b.AddDiagonal(1, 2.5);
        var a = b.Build();
        AssertStorageInvariants(a);
        Assert.Equal(4.0, a.Diagonal(0));
        Assert.Equal(4.0, a.Diagonal(1));
        Assert.Equal(4.0, a.Diagonal(2));
        var d = a.ToDense();
        Assert.Equal(-2.0, d[2, 0]);
        Assert.Equal(-2.0, d[0, 2]);
        Assert.Equal(4, a.NonZerosLower); // (0,0), (2,0), (1,1), (2,2): one entry per position
    }

    [Fact]
    public void NegativeIndicesAreSkipped()
    {
        // A 3-DOF element with its middle DOF restrained (−1): only the 2×2 corner block lands, at global 4 and 1.
        var ke = new[,] { { 5.0, 1.0, 2.0 }, { 1.0, 6.0, 3.0 }, { 2.0, 3.0, 7.0 } };
        var b = new SymmetricMatrixBuilder(5);
        b.AddElement(new[] { 4, -1, 1 }, ke);
        var a = b.Build();
        AssertStorageInvariants(a);
        var expected = new double[5, 5];
        expected[4, 4] = 5.0; expected[1, 1] = 7.0; expected[4, 1] = 2.0; expected[1, 4] = 2.0;
        Assert.Equal(expected, a.ToDense());
    }

    [Fact]
    public void OutOfRangeIndicesThrow()
    {
        var b = new SymmetricMatrixBuilder(3);
        Assert.Throws<ArgumentOutOfRangeException>(() => b.AddDiagonal(3, 1.0));
        Assert.Throws<ArgumentOutOfRangeException>(() => b.AddElement(new[] { 0, 3 }, new double[2, 2]));
        Assert.Throws<ArgumentException>(() => b.AddElement(new[] { 0, 1 }, new double[3, 3]));
    }

    [Fact]
    public void RandomElementAssembly_MatchesDenseAssembly_AndMultiplyMatchesDense()
    {
        var rng = new Random(42);
        int n = 37;
        var dense = new double[n, n];
        var b = new SymmetricMatrixBuilder(n);
        for (int e = 0; e < 60; e++)
        {
            int m = 1 + rng.Next(6);
            var dofs = Enumerable.Range(0, m).Select(_ => rng.Next(-3, n)).ToArray(); // some restrained, repeats possible
            var ke = new double[m, m];
            for (int r = 0; r < m; r++)
                for (int c = 0; c <= r; c++)
                    ke[r, c] = ke[c, r] = Math.Round(rng.NextDouble() * 8 - 4, 3);
            b.AddElement(dofs, ke);
            for (int r = 0; r < m; r++)
                for (int c = 0; c < m; c++)
                    if (dofs[r] >= 0 && dofs[c] >= 0) dense[dofs[r], dofs[c]] += ke[r, c];
        }
        var a = b.Build();
        AssertStorageInvariants(a);
        var got = a.ToDense();
        for (int i = 0; i < n; i++)
            for (int j = 0; j < n; j++)
                Assert.True(Math.Abs(got[i, j] - dense[i, j]) < 1e-12, $"({i},{j}): {got[i, j]} vs {dense[i, j]}");

        var x = RandomVector(n, 43);
        var y = new double[n];
        a.Multiply(x, y);
        for (int i = 0; i < n; i++)
        {
            double s = 0;
            for (int j = 0; j < n; j++) s += dense[i, j] * x[j];
            Assert.True(Math.Abs(y[i] - s) < 1e-11, $"row {i}");
        }
    }

    [Fact]
    public void ABuilderIsBuiltOnce()
    {
        // Its triplets go back to the shared pool when the matrix is built, so a second build or a later entry is refused.
        var b = new SymmetricMatrixBuilder(2, 4);
        b.AddDiagonal(0, 1.0);
        b.Build();
        Assert.Throws<InvalidOperationException>(() => b.Build());
        Assert.Throws<InvalidOperationException>(() => b.AddDiagonal(1, 1.0));
    }

    [Fact]
    public void ASmallMatrixBuiltAfterALargeOne_HoldsOnlyItsOwnEntries()
    {
        // The pooled working arrays come back holding the large matrix's entries; the small one must not see them.
        // Expected values derived by direct stiffness summation (common practice): two unit springs between DOFs 0 and 1
        // each add [[1, -1], [-1, 1]], and 1 on each diagonal gives [[3, -2], [-2, 3]]; an inner DOF of the large chain
        // of springs of stiffness 7 (off-diagonal -5) gets 7 from each of its two elements.
        for (int round = 0; round < 3; round++)
        {
            var large = new SymmetricMatrixBuilder(400, 4000);
            for (int i = 0; i < 399; i++) large.AddElement(new[] { i, i + 1 }, new[,] { { 7.0, -5.0 }, { -5.0, 7.0 } });
            Assert.Equal(7.0 * 2, large.Build().Diagonal(200));

            var small = new SymmetricMatrixBuilder(2);
            var spring = new[,] { { 1.0, -1.0 }, { -1.0, 1.0 } };
            small.AddElement(new[] { 0, 1 }, spring);
            small.AddElement(new[] { 1, 0 }, spring);
            small.AddDiagonal(0, 1.0);
            small.AddDiagonal(1, 1.0);
            var a = small.Build();
            AssertStorageInvariants(a);
            Assert.Equal(3, a.NonZerosLower);
            Assert.Equal(new[,] { { 3.0, -2.0 }, { -2.0, 3.0 } }, a.ToDense());
        }
    }

    [Fact]
    public void MatrixMarket_RoundTrips()
    {
        // Format: Boisvert, Pozo and Remington, "The Matrix Market Exchange Formats: Initial Design" (NIST, 1996).
        var a = RandomLaplacianPlusDiagonal(25, 9);
        var sw = new StringWriter(CultureInfo.InvariantCulture);
        a.WriteMatrixMarket(sw, "test matrix\nsecond line");
        string text = sw.ToString();
        Assert.StartsWith("%%MatrixMarket matrix coordinate real symmetric\n", text);

        var back = ReadMatrixMarket(text);
        Assert.Equal(a.Size, back.GetLength(0));
        Assert.Equal(a.ToDense(), back); // "R" formatting round-trips doubles exactly
    }

    /// <summary>A small independent reader: coordinate real symmetric, 1-based, comments start with '%'.</summary>
    private static double[,] ReadMatrixMarket(string text)
    {
        var lines = text.Split('\n', StringSplitOptions.RemoveEmptyEntries);
        Assert.Equal("%%MatrixMarket matrix coordinate real symmetric", lines[0].Trim());
        int k = 1;
        while (lines[k].StartsWith('%')) k++;
        var header = lines[k++].Split(' ', StringSplitOptions.RemoveEmptyEntries).Select(int.Parse).ToArray();
        Assert.Equal(header[0], header[1]);
        var m = new double[header[0], header[1]];
        int count = 0;
        for (; k < lines.Length; k++)
        {
            var parts = lines[k].Split(' ', StringSplitOptions.RemoveEmptyEntries);
            int i = int.Parse(parts[0], CultureInfo.InvariantCulture) - 1;
            int j = int.Parse(parts[1], CultureInfo.InvariantCulture) - 1;
            double v = double.Parse(parts[2], CultureInfo.InvariantCulture);
            Assert.True(i >= j, "symmetric storage lists the lower triangle");
            m[i, j] += v;
            if (i != j) m[j, i] += v;
            count++;
        }
        Assert.Equal(header[2], count);
        return m;
    }
}
