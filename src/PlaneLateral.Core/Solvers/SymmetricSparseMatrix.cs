using System.Globalization;

namespace PlaneLateral.Solvers;

/// <summary>
/// An immutable sparse symmetric matrix stored as its lower triangle in compressed sparse column form:
/// column j holds rows RowIndices[ColumnPointers[j] .. ColumnPointers[j+1]) in ascending order, each ≥ j,
/// with the diagonal first when present.
/// </summary>
public sealed class SymmetricSparseMatrix
{
    internal SymmetricSparseMatrix(int size, int[] columnPointers, int[] rowIndices, double[] values)
    {
        Size = size;
        ColumnPointers = columnPointers;
        RowIndices = rowIndices;
        Values = values;
    }

    /// <summary>Order of the matrix.</summary>
    public int Size { get; }

    /// <summary>Column starts, length Size + 1.</summary>
    public int[] ColumnPointers { get; }

    /// <summary>Row index of every stored entry (lower triangle, ascending within a column).</summary>
    public int[] RowIndices { get; }

    /// <summary>Value of every stored entry.</summary>
    public double[] Values { get; }

    /// <summary>Stored entries (lower triangle with diagonal).</summary>
    public int NonZerosLower => ColumnPointers[Size];

    /// <summary>Diagonal entry K_ii (0 when not stored).</summary>
    public double Diagonal(int i)
    {
        int p = ColumnPointers[i];
        return p < ColumnPointers[i + 1] && RowIndices[p] == i ? Values[p] : 0.0;
    }

    /// <summary>‖K‖∞ = max row sum of |K_ij| over the full symmetric matrix (0 for an empty matrix).</summary>
    public double InfinityNorm()
    {
        var rowSum = new double[Size];
        for (int j = 0; j < Size; j++)
            for (int p = ColumnPointers[j]; p < ColumnPointers[j + 1]; p++)
            {
                int i = RowIndices[p];
                double a = Math.Abs(Values[p]);
                rowSum[i] += a;
                if (i != j) rowSum[j] += a;
            }
        return rowSum.Length == 0 ? 0 : rowSum.Max();
    }

    /// <summary>y = K·x with the full symmetric matrix.</summary>
    public void Multiply(ReadOnlySpan<double> x, Span<double> y)
    {
        if (x.Length != Size || y.Length != Size) throw new ArgumentException("Vector length differs from the matrix size.");
        y.Clear();
        for (int j = 0; j < Size; j++)
        {
            double xj = x[j];
            double sum = 0.0;
            for (int p = ColumnPointers[j]; p < ColumnPointers[j + 1]; p++)
            {
                int i = RowIndices[p];
                double v = Values[p];
                y[i] += v * xj;
                if (i != j) sum += v * x[i];
            }
            y[j] += sum;
        }
    }

    /// <summary>The full dense matrix (for tests and small problems only).</summary>
    public double[,] ToDense()
    {
        var a = new double[Size, Size];
        for (int j = 0; j < Size; j++)
            for (int p = ColumnPointers[j]; p < ColumnPointers[j + 1]; p++)
            {
                int i = RowIndices[p];
                a[i, j] = Values[p];
                a[j, i] = Values[p];
            }
        return a;
    }

    /// <summary>Writes the matrix in Matrix Market coordinate format, "real symmetric", lower triangle, 1-based.</summary>
    public void WriteMatrixMarket(TextWriter writer, string? comment = null)
    {
        writer.Write("%%MatrixMarket matrix coordinate real symmetric\n");
        if (comment is not null)
            foreach (var line in comment.Split('\n')) writer.Write("% " + line + "\n");
        writer.Write(string.Create(CultureInfo.InvariantCulture, $"{Size} {Size} {NonZerosLower}\n"));
        for (int j = 0; j < Size; j++)
            for (int p = ColumnPointers[j]; p < ColumnPointers[j + 1]; p++)
                writer.Write(string.Create(CultureInfo.InvariantCulture, $"{RowIndices[p] + 1} {j + 1} {Values[p]:R}\n"));
    }
}
