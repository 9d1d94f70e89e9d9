namespace PlaneLateral.Solvers;

/// <summary>
/// Collects the entries of a symmetric matrix as coordinate triplets (duplicates are summed) and compresses them
/// into a <see cref="SymmetricSparseMatrix"/>. Only the lower triangle is kept.
/// </summary>
public sealed class SymmetricMatrixBuilder
{
    private readonly List<(int Row, int Col, double Value)> _entries;

    public SymmetricMatrixBuilder(int size, int capacityHint = 0)
    {
        ArgumentOutOfRangeException.ThrowIfNegative(size);
        Size = size;
        _entries = new List<(int, int, double)>(capacityHint);
    }

    public int Size { get; }

    /// <summary>Adds v to K_ii.</summary>
    public void AddDiagonal(int i, double value)
    {
        if ((uint)i >= (uint)Size) throw new ArgumentOutOfRangeException(nameof(i));
        _entries.Add((i, i, value));
    }

    /// <summary>
    /// Adds a dense symmetric element matrix <paramref name="ke"/> whose row/column a maps to global index dofs[a];
    /// a negative index means "not an unknown" (restrained) and that row and column are skipped.
    /// Each off-diagonal pair is added once, from the lower triangle in global numbering.
    /// </summary>
    public void AddElement(ReadOnlySpan<int> dofs, double[,] ke)
    {
        int n = dofs.Length;
        if (ke.GetLength(0) != n || ke.GetLength(1) != n) throw new ArgumentException("Element matrix size differs from its DOF list.");
        for (int a = 0; a < n; a++)
        {
            int gi = dofs[a];
            if (gi < 0) continue;
            if (gi >= Size) throw new ArgumentOutOfRangeException(nameof(dofs));
            for (int b = 0; b < n; b++)
            {
                int gj = dofs[b];
                if (gj < 0 || gj > gi) continue;
                _entries.Add((gi, gj, ke[a, b]));
            }
        }
    }

    /// <summary>Compresses the triplets: lower triangle, rows ascending in each column, duplicates summed.</summary>
    public SymmetricSparseMatrix Build()
    {
        var counts = new int[Size + 1];
        foreach (var (r, c, _) in _entries) counts[c + 1]++;
        for (int j = 0; j < Size; j++) counts[j + 1] += counts[j];
        var rows = new int[_entries.Count];
        var vals = new double[_entries.Count];
        var next = (int[])counts.Clone();
        foreach (var (r, c, v) in _entries)
        {
            int p = next[c]++;
            rows[p] = r;
            vals[p] = v;
        }

        var colPtr = new int[Size + 1];
        var outRows = new List<int>(_entries.Count);
        var outVals = new List<double>(_entries.Count);
        for (int j = 0; j < Size; j++)
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
        return new SymmetricSparseMatrix(Size, colPtr, outRows.ToArray(), outVals.ToArray());
    }
}
