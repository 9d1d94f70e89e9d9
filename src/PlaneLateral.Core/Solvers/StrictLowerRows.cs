namespace PlaneLateral.Solvers;

/// <summary>
/// The strictly lower triangle of a <see cref="SymmetricSparseMatrix"/> by rows, in the matrix's own numbering: row i lists
/// the columns j &lt; i of its entries in ascending order, each with the index of the entry in the matrix's arrays. With
/// the matrix's columns (rows ≥ j) it gives every node's neighbours without a permuted transpose, so the symbolic analysis
/// reads the pattern by gathering (node by node, in any order: elimination tree, column counts, row patterns, the columns
/// of P·K·Pᵀ) instead of scattering it again for each numbering. Built once per factorisation (one count and one scatter
/// in the matrix's numbering, which for a finite-element numbering is nearly local), on a second thread while the
/// ordering runs.
/// </summary>
internal sealed class StrictLowerRows
{
    public readonly int[] RowPtr;   // length n + 1
    public readonly int[] Cols;     // ascending within a row
    public readonly int[] Source;   // index of the entry in the matrix's RowIndices / Values

    private StrictLowerRows(int[] rowPtr, int[] cols, int[] source)
    {
        RowPtr = rowPtr;
        Cols = cols;
        Source = source;
    }

    public static StrictLowerRows Of(SymmetricSparseMatrix a)
    {
        ArgumentNullException.ThrowIfNull(a);
        int n = a.Size;
        var cp = a.ColumnPointers;
        var ri = a.RowIndices;
        var rowPtr = new int[n + 1];
        // The diagonal is first in its column when stored (SymmetricSparseMatrix's layout).
        for (int j = 0; j < n; j++)
        {
            int p0 = cp[j], p1 = cp[j + 1];
            if (p0 < p1 && ri[p0] == j) p0++;
            for (int p = p0; p < p1; p++) rowPtr[ri[p] + 1]++;
        }
        for (int i = 0; i < n; i++) rowPtr[i + 1] += rowPtr[i];
        int nz = rowPtr[n];
        var cols = GC.AllocateUninitializedArray<int>(nz);
        var source = GC.AllocateUninitializedArray<int>(nz);
        var next = GC.AllocateUninitializedArray<int>(n);
        Array.Copy(rowPtr, next, n);
        for (int j = 0; j < n; j++)
        {
            int p0 = cp[j], p1 = cp[j + 1];
            if (p0 < p1 && ri[p0] == j) p0++;
            for (int p = p0; p < p1; p++)
            {
                int q = next[ri[p]]++;
                cols[q] = j;
                source[q] = p;
            }
        }
        return new StrictLowerRows(rowPtr, cols, source);
    }
}
