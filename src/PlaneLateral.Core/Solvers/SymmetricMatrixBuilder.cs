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

        // Duplicates are summed in place (the write position never passes the read position, and each column is sorted
        // before it is read), in the same order as before, so the values are the same to the bit; only the result is
        // copied out at its final size. No second pair of triplet-sized arrays: issue 19, the builder's peak set the
        // process's peak memory at 10⁶ unknowns (docs/solver.md, "Process peak memory").
        var colPtr = new int[Size + 1];
        int w = 0;
        for (int j = 0; j < Size; j++)
        {
            int start = counts[j], end = counts[j + 1], colStart = w;
            Array.Sort(rows, vals, start, end - start);
            for (int p = start; p < end; p++)
            {
                if (w > colStart && rows[w - 1] == rows[p]) vals[w - 1] += vals[p];
                else { rows[w] = rows[p]; vals[w] = vals[p]; w++; }
            }
            colPtr[j + 1] = w;
        }
        if (w < rows.Length)
        {
            rows = rows.AsSpan(0, w).ToArray();
            vals = vals.AsSpan(0, w).ToArray();
        }
        return new SymmetricSparseMatrix(Size, colPtr, rows, vals);
    }
}
