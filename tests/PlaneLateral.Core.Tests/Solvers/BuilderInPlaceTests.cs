using PlaneLateral.Solvers;

namespace PlaneLateral.Tests.Solvers;

/// <summary>
/// Issue 19: <see cref="SymmetricMatrixBuilder.Build"/> sums duplicates in place instead of into a second pair of
/// triplet-sized lists. The sums must be the same to the bit, so the factor and every result stay bitwise unchanged. The
/// reference below is the former compression, kept here verbatim in substance (per column: the same sort, then duplicates
/// summed left to right into growing lists); both are fed the same triplets, many of them repeated with values whose sums
/// depend on their order in floating point (derived: (a + b) + c ≠ a + (b + c) in general).
/// </summary>
public class BuilderInPlaceTests
{
    private static (int[] ColPtr, int[] Rows, double[] Vals) Reference(int n, List<(int Row, int Col, double Value)> entries)
    {
        var counts = new int[n + 1];
        foreach (var (_, c, _) in entries) counts[c + 1]++;
        for (int j = 0; j < n; j++) counts[j + 1] += counts[j];
        var rows = new int[entries.Count];
        var vals = new double[entries.Count];
        var next = (int[])counts.Clone();
        foreach (var (r, c, v) in entries)
        {
            int p = next[c]++;
            rows[p] = r;
            vals[p] = v;
        }
        var colPtr = new int[n + 1];
        var outRows = new List<int>();
        var outVals = new List<double>();
        for (int j = 0; j < n; j++)
        {
            int start = counts[j], end = counts[j + 1];
            Array.Sort(rows, vals, start, end - start);
            for (int p = start; p < end; p++)
            {
                if (outRows.Count > colPtr[j] && outRows[^1] == rows[p]) outVals[^1] += vals[p];
                else { outRows.Add(rows[p]); outVals.Add(vals[p]); }
            }
            colPtr[j + 1] = outRows.Count;
        }
        return (colPtr, outRows.ToArray(), outVals.ToArray());
    }

    [Theory]
    [InlineData(1, 40, 2_000)]
    [InlineData(2, 300, 20_000)]
    [InlineData(3, 1, 50)]
    public void InPlaceSummation_IsBitwiseTheFormerOne(int seed, int n, int count)
    {
        var rng = new Random(seed);
        var b = new SymmetricMatrixBuilder(n);
        var entries = new List<(int, int, double)>();
        for (int e = 0; e < count; e++)
        {
            int i = rng.Next(n), j = rng.Next(i + 1);
            // Values over many magnitudes, so that the order of a sum shows in its last bits.
            double v = (rng.NextDouble() - 0.5) * Math.Pow(10, rng.Next(-8, 9));
            if (i == j) b.AddDiagonal(i, v);
            else b.AddElement(new[] { i, j }, new double[,] { { 0, v }, { v, 0 } });
            if (i == j) entries.Add((i, i, v));
            else { entries.Add((i, i, 0.0)); entries.Add((i, j, v)); entries.Add((j, j, 0.0)); }
        }
        var a = b.Build();
        var (colPtr, rows, vals) = Reference(n, entries);
        Assert.Equal(colPtr, a.ColumnPointers);
        Assert.Equal(rows, a.RowIndices);
        Assert.Equal(vals.Length, a.Values.Length);
        for (int p = 0; p < vals.Length; p++)
            Assert.Equal(BitConverter.DoubleToInt64Bits(vals[p]), BitConverter.DoubleToInt64Bits(a.Values[p]));
        Assert.True(a.NonZerosLower < count, "the triplets held duplicates, so something was summed");
    }
}
