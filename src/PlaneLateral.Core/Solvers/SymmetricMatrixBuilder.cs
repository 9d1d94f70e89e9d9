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
/// order, as with fresh arrays. Arrays larger than <see cref="PooledLength"/> elements are allocated and left to the
/// collector instead: the pool would keep them alive beside a large factor and raise the process's peak memory
/// (issue 19, docs/solver.md, "Process peak memory").
/// </remarks>
public sealed class SymmetricMatrixBuilder
{
    private (int Row, int Col, double Value)[] _entries;
    private int _count;
    private bool _built;

    /// <summary>The largest array, in elements, taken from and given back to the shared pool (2²⁰: 16 MiB of triplets).</summary>
    public const int PooledLength = 1 << 20;

    public SymmetricMatrixBuilder(int size, int capacityHint = 0)
    {
        ArgumentOutOfRangeException.ThrowIfNegative(size);
        ArgumentOutOfRangeException.ThrowIfNegative(capacityHint);
        Size = size;
        _entries = capacityHint > 0 ? Rent<(int, int, double)>(capacityHint) : [];
    }

    private static T[] Rent<T>(int length) => length <= PooledLength ? ArrayPool<T>.Shared.Rent(length) : new T[length];

    private static void Return<T>(T[] array)
    {
        if (array.Length > 0 && array.Length <= PooledLength) ArrayPool<T>.Shared.Return(array);
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
        var bigger = Rent<(int, int, double)>(Math.Max(16, 2 * _entries.Length));
        _entries.AsSpan(0, _count).CopyTo(bigger);
        Return(_entries);
        _entries = bigger;
    }

    /// <summary>Compresses the triplets: lower triangle, rows ascending in each column, duplicates summed. Call it once.</summary>
    /// <exception cref="InvalidOperationException">The builder was built already.</exception>
    public SymmetricSparseMatrix Build()
    {
        if (_built) throw new InvalidOperationException("The matrix was built already; a builder is built once.");
        _built = true;
        int count = _count;
        var entries = _entries;
        var counts = Rent<int>(Size + 1);
        var next = Rent<int>(Size + 1);
        var rows = Rent<int>(count);
        var vals = Rent<double>(count);
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

            // Duplicates are summed in place (the write position never passes the read position, and each column is
            // sorted before it is read), in the same order as with separate output arrays, so the values are the same to
            // the bit; only the result is copied out at its final size. No second pair of triplet-sized arrays: issue 19,
            // the builder's peak set the process's peak memory at 10⁶ unknowns (docs/solver.md, "Process peak memory").
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
            return new SymmetricSparseMatrix(Size, colPtr, rows.AsSpan(0, w).ToArray(), vals.AsSpan(0, w).ToArray());
        }
        finally
        {
            Return(counts);
            Return(next);
            Return(rows);
            Return(vals);
            Return(entries);
            _entries = [];
            _count = 0;
        }
    }
}
