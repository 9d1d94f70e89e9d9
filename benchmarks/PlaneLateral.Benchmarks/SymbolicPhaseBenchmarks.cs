using BenchmarkDotNet.Attributes;
using BenchmarkDotNet.Engines;
using PlaneLateral.Solvers;

namespace PlaneLateral.Benchmarks;

/// <summary>
/// The symbolic phase's column counts, before and after (issue 19, item 3), on the same postordered plane-stress walls in
/// one run: the row-subtree walk the phase used (O(nnz(L)), kept here as the baseline) against the leaf and least-common-
/// ancestor count it uses now (Gilbert, Ng and Peyton 1994: O(nnz(A)·α)); and the whole analysis and the ordering, now and as
/// they were before session 6's speed work (<see cref="PreviousPhases"/>). Compare the ratios.
/// </summary>
[MemoryDiagnoser]
[SimpleJob(RunStrategy.Monitoring, launchCount: 1, warmupCount: 2, iterationCount: 9)]
public class SymbolicPhaseBenchmarks
{
    /// <summary>Nodes per side: 71 → 9,940 unknowns; 224 → 99,904.</summary>
    [Params(71, 224)]
    public int Side { get; set; }

    private SymmetricSparseMatrix _a = null!;
    private int[] _perm = null!, _parent = null!, _colPtr = null!, _rows = null!, _rowPtr = null!, _cols = null!;

    [GlobalSetup]
    public void Setup()
    {
        _a = PlaneStressGrid.Build(Side, Side);
        _perm = new SupernodalCholeskySolver().ComputeOrdering(_a);
        var s = SupernodalSymbolic.Analyse(_a, _perm);   // its permutation is postordered
        var inv = Orderings.Inverse(s.Perm);
        SupernodalSymbolic.LowerByColumn(_a, inv, out _colPtr, out _rows, out _);
        int n = _a.Size;
        // Rows of the strictly lower part (the subtree walk's input) and the elimination tree in this numbering.
        _rowPtr = new int[n + 1];
        for (int j = 0; j < n; j++) for (int p = _colPtr[j]; p < _colPtr[j + 1]; p++) if (_rows[p] != j) _rowPtr[_rows[p] + 1]++;
        for (int i = 0; i < n; i++) _rowPtr[i + 1] += _rowPtr[i];
        var next = (int[])_rowPtr.Clone();
        _cols = new int[_rowPtr[n]];
        for (int j = 0; j < n; j++) for (int p = _colPtr[j]; p < _colPtr[j + 1]; p++) if (_rows[p] != j) _cols[next[_rows[p]]++] = j;
        _parent = new int[n];
        var ancestor = new int[n];
        for (int k = 0; k < n; k++)
        {
            _parent[k] = ancestor[k] = -1;
            for (int p = _rowPtr[k]; p < _rowPtr[k + 1]; p++)
                for (int r = _cols[p]; r != -1 && r != k;)
                {
                    int t = ancestor[r];
                    ancestor[r] = k;
                    if (t == -1) { _parent[r] = k; break; }
                    r = t;
                }
        }
        if (!SubtreeWalk().AsSpan().SequenceEqual(SupernodalSymbolic.ColumnCounts(n, _parent, _colPtr, _rows)))
            throw new InvalidOperationException("the two column counts differ");
    }

    /// <summary>The phase's former count: walk each row's subtree up to the first node marked for that row.</summary>
    [Benchmark(Baseline = true)]
    public int[] SubtreeWalk()
    {
        int n = _a.Size;
        var count = new int[n];
        var mark = new int[n];
        Array.Fill(mark, -1);
        for (int k = 0; k < n; k++)
        {
            mark[k] = k;
            count[k]++;
            for (int p = _rowPtr[k]; p < _rowPtr[k + 1]; p++)
                for (int j = _cols[p]; j != -1 && mark[j] != k; j = _parent[j])
                {
                    mark[j] = k;
                    count[j]++;
                }
        }
        return count;
    }

    [Benchmark]
    public int[] LeavesAndAncestors() => SupernodalSymbolic.ColumnCounts(_a.Size, _parent, _colPtr, _rows);

    [Benchmark]
    public long WholeAnalysis() => SupernodalSymbolic.Analyse(_a, _perm).StoredEntries;

    /// <summary>The whole analysis as it was before session 6 (<see cref="PreviousPhases"/>).</summary>
    [Benchmark]
    public long WholeAnalysisBefore() => PreviousPhases.Analyse(_a, _perm).StoredEntries;

    /// <summary>The approximate minimum degree ordering now.</summary>
    [Benchmark]
    public int[] Ordering() => MinimumDegreeOrdering.Compute(_a);

    /// <summary>The ordering as it was before session 6 (<see cref="PreviousPhases"/>).</summary>
    [Benchmark]
    public int[] OrderingBefore() => PreviousPhases.Order(_a);
}
