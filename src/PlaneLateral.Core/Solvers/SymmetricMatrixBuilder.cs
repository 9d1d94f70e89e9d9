using System.Buffers;

namespace PlaneLateral.Solvers;

/// <summary>
/// Collects the entries of a symmetric matrix as coordinate triplets (duplicates are summed) and compresses them
/// into a <see cref="SymmetricSparseMatrix"/>. Only the lower triangle is kept.
/// </summary>
/// <remarks>
/// The triplets and <see cref="Build"/>'s working arrays are rented from <see cref="ArrayPool{T}.Shared"/> and given back
/// when the matrix is built, so that a thread assembling one system after another (the sweep's points, a convergence
/// study's meshes) reuses the same memory instead of asking the collector for a fresh large-object array each time: a
/// builder is built once. Only the compressed matrix is newly allocated; its entries are the same, summed in the same
/// order, as with fresh arrays.
/// </remarks>
public sealed class SymmetricMatrixBuilder
{
    private (int Row, int Col, double Value)[] _entries;
    private int _count;
    private bool _built;

    public SymmetricMatrixBuilder(int size, int capacityHint = 0)
    {
        ArgumentOutOfRangeException.ThrowIfNegative(size);
        ArgumentOutOfRangeException.ThrowIfNegative(capacityHint);
        Size = size;
        _entries = capacityHint > 0 ? ArrayPool<(int, int, double)>.Shared.Rent(capacityHint) : [];
    }

    public int Size { get; }

    /// <summary>Adds v to K_ii.</summary>
    public void AddDiagonal(int i, double value)
    {
        if ((uint)i >= (uint)Size) throw new ArgumentOutOfRangeException(nameof(i));
        Add(i, i, value);
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
                Add(gi, gj, ke[a, b]);
            }
        }
    }

    private void Add(int row, int col, double value)
    {
        if (_built) throw new InvalidOperationException("The matrix was built already; a builder is built once.");
        if (_count == _entries.Length) Grow();
        _entries[_count++] = (row, col, value);
    }

    private void Grow()
    {
        var pool = ArrayPool<(int, int, double)>.Shared;
        var bigger = pool.Rent(Math.Max(16, 2 * _entries.Length));
        _entries.AsSpan(0, _count).CopyTo(bigger);
        if (_entries.Length > 0) pool.Return(_entries);
        _entries = bigger;
    }

    /// <summary>Compresses the triplets: lower triangle, rows ascending in each column, duplicates summed. Call it once.</summary>
    /// <exception cref="InvalidOperationException">The builder was built already.</exception>
    public SymmetricSparseMatrix Build()
    {
        if (_built) throw new InvalidOperationException("The matrix was built already; a builder is built once.");
        _built = true;
        var ints = ArrayPool<int>.Shared;
        var doubles = ArrayPool<double>.Shared;
        int count = _count;
        var entries = _entries;
        var counts = ints.Rent(Size + 1);
        var next = ints.Rent(Size + 1);
        var rows = ints.Rent(count);
        var vals = doubles.Rent(count);
        var outRows = ints.Rent(count);
        var outVals = doubles.Rent(count);
        try
        {
            Array.Clear(counts, 0, Size + 1);
            for (int e = 0; e < count; e++) counts[entries[e].Col + 1]++;
            for (int j = 0; j < Size; j++) counts[j + 1] += counts[j];
            Array.Copy(counts, next, Size + 1);
            for (int e = 0; e < count; e++)
            {
                var (r, c, v) = entries[e];
                int p = next[c]++;
                rows[p] = r;
                vals[p] = v;
            }

            var colPtr = new int[Size + 1];
            int m = 0;
            for (int j = 0; j < Size; j++)
            {
                int start = counts[j], end = counts[j + 1];
                Array.Sort(rows, vals, start, end - start);
                for (int p = start; p < end; p++)
                {
                    if (m > colPtr[j] && outRows[m - 1] == rows[p]) outVals[m - 1] += vals[p];
                    else { outRows[m] = rows[p]; outVals[m] = vals[p]; m++; }
                }
                colPtr[j + 1] = m;
            }
            return new SymmetricSparseMatrix(Size, colPtr, outRows.AsSpan(0, m).ToArray(), outVals.AsSpan(0, m).ToArray());
        }
        finally
        {
            ints.Return(counts);
            ints.Return(next);
            ints.Return(rows);
            doubles.Return(vals);
            ints.Return(outRows);
            doubles.Return(outVals);
            if (entries.Length > 0) ArrayPool<(int, int, double)>.Shared.Return(entries);
            _entries = [];
            _count = 0;
        }
    }
}
