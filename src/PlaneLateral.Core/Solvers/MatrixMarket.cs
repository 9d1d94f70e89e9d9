using System.Globalization;

namespace PlaneLateral.Solvers;

/// <summary>
/// Matrix Market text files (NIST format: "%%MatrixMarket matrix coordinate|array real symmetric|general"), enough to
/// exchange test matrices and right-hand sides with other tools. Writing a matrix: <see cref="SymmetricSparseMatrix.WriteMatrixMarket"/>.
/// </summary>
public static class MatrixMarket
{
    /// <summary>
    /// Reads a "coordinate real symmetric" (or "integer"/"pattern": pattern entries read as 1) matrix. Entries of either
    /// triangle are accepted and stored in the lower one; duplicates are summed.
    /// </summary>
    public static SymmetricSparseMatrix ReadSymmetric(TextReader reader)
    {
        ArgumentNullException.ThrowIfNull(reader);
        string? header = reader.ReadLine();
        if (header is null || !header.StartsWith("%%MatrixMarket", StringComparison.OrdinalIgnoreCase))
            throw new FormatException("Not a Matrix Market file (no %%MatrixMarket header).");
        var h = header.Split(' ', StringSplitOptions.RemoveEmptyEntries);
        if (h.Length < 5 || !h[1].Equals("matrix", StringComparison.OrdinalIgnoreCase) || !h[2].Equals("coordinate", StringComparison.OrdinalIgnoreCase))
            throw new FormatException("Only \"matrix coordinate\" files can be read as a sparse matrix.");
        bool pattern = h[3].Equals("pattern", StringComparison.OrdinalIgnoreCase);
        if (!h[4].Equals("symmetric", StringComparison.OrdinalIgnoreCase))
            throw new FormatException("Only symmetric matrices can be read.");
        string? line;
        do line = reader.ReadLine(); while (line is not null && (line.StartsWith('%') || line.Trim().Length == 0));
        if (line is null) throw new FormatException("Size line missing.");
        var size = line.Split((char[]?)null, StringSplitOptions.RemoveEmptyEntries);
        int n = int.Parse(size[0], CultureInfo.InvariantCulture);
        if (int.Parse(size[1], CultureInfo.InvariantCulture) != n) throw new FormatException("Matrix is not square.");
        long nnz = long.Parse(size[2], CultureInfo.InvariantCulture);
        var b = new SymmetricMatrixBuilder(n, (int)Math.Min(nnz, int.MaxValue / 2));
        var pair = new int[2];
        var ke = new double[2, 2];
        for (long e = 0; e < nnz; e++)
        {
            line = reader.ReadLine() ?? throw new FormatException($"Entry {e + 1} of {nnz} missing.");
            var t = line.Split((char[]?)null, StringSplitOptions.RemoveEmptyEntries);
            int i = int.Parse(t[0], CultureInfo.InvariantCulture) - 1;
            int j = int.Parse(t[1], CultureInfo.InvariantCulture) - 1;
            double v = pattern ? 1.0 : double.Parse(t[2], CultureInfo.InvariantCulture);
            if (i == j) { b.AddDiagonal(i, v); continue; }
            pair[0] = i;
            pair[1] = j;
            ke[0, 1] = ke[1, 0] = v;
            b.AddElement(pair, ke);
        }
        return b.Build();
    }

    /// <summary>Writes a vector as a Matrix Market "array real general" n×1 matrix (round-trip precision).</summary>
    public static void WriteArray(TextWriter writer, ReadOnlySpan<double> vector, string? comment = null)
    {
        ArgumentNullException.ThrowIfNull(writer);
        writer.Write("%%MatrixMarket matrix array real general\n");
        if (comment is not null)
            foreach (var l in comment.Split('\n')) writer.Write("% " + l + "\n");
        writer.Write(string.Create(CultureInfo.InvariantCulture, $"{vector.Length} 1\n"));
        foreach (double v in vector) writer.Write(string.Create(CultureInfo.InvariantCulture, $"{v:R}\n"));
    }

    /// <summary>Reads a Matrix Market "array real general" n×1 matrix.</summary>
    public static double[] ReadArray(TextReader reader)
    {
        var columns = ReadColumns(reader);
        return columns.Length == 1 ? columns[0] : throw new FormatException("Only one column is read.");
    }

    /// <summary>
    /// Writes vectors of one length as the columns of a Matrix Market "array real general" n×m matrix (values column by
    /// column, as the format orders them; round-trip precision).
    /// </summary>
    public static void WriteColumns(TextWriter writer, int rows, IReadOnlyList<double[]> columns, string? comment = null)
    {
        ArgumentNullException.ThrowIfNull(writer);
        ArgumentNullException.ThrowIfNull(columns);
        writer.Write("%%MatrixMarket matrix array real general\n");
        if (comment is not null)
            foreach (var l in comment.Split('\n')) writer.Write("% " + l + "\n");
        writer.Write(string.Create(CultureInfo.InvariantCulture, $"{rows} {columns.Count}\n"));
        foreach (var c in columns)
        {
            if (c.Length != rows) throw new ArgumentException($"a column has {c.Length} values, not {rows}", nameof(columns));
            foreach (double v in c) writer.Write(string.Create(CultureInfo.InvariantCulture, $"{v:R}\n"));
        }
    }

    /// <summary>Reads a Matrix Market "array real general" n×m matrix as its m columns.</summary>
    public static double[][] ReadColumns(TextReader reader)
    {
        ArgumentNullException.ThrowIfNull(reader);
        string? header = reader.ReadLine();
        if (header is null || !header.StartsWith("%%MatrixMarket", StringComparison.OrdinalIgnoreCase) || !header.Contains("array", StringComparison.OrdinalIgnoreCase))
            throw new FormatException("Not a Matrix Market array file.");
        string? line;
        do line = reader.ReadLine(); while (line is not null && (line.StartsWith('%') || line.Trim().Length == 0));
        if (line is null) throw new FormatException("Size line missing.");
        var size = line.Split((char[]?)null, StringSplitOptions.RemoveEmptyEntries);
        int n = int.Parse(size[0], CultureInfo.InvariantCulture), m = int.Parse(size[1], CultureInfo.InvariantCulture);
        var cols = new double[m][];
        for (int j = 0; j < m; j++)
        {
            cols[j] = new double[n];
            for (int i = 0; i < n; i++)
                cols[j][i] = double.Parse((reader.ReadLine() ?? throw new FormatException("Value missing.")).Trim(), CultureInfo.InvariantCulture);
        }
        return cols;
    }
}
