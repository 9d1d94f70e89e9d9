using System.Globalization;
using System.Text;

namespace PlaneLateral.Cli;

/// <summary>A plain fixed-width text table: left-aligned text columns, right-aligned number columns.</summary>
internal sealed class TextTable(params string[] headers)
{
    private readonly List<string[]> _rows = [];
    private readonly bool[] _numeric = headers.Select(h => false).ToArray();

    public TextTable Numeric(params int[] columns)
    {
        foreach (int c in columns) _numeric[c] = true;
        return this;
    }

    public void Add(params string[] cells) => _rows.Add(cells);

    public string Render(string indent = "  ")
    {
        int n = headers.Length;
        var width = new int[n];
        for (int c = 0; c < n; c++) width[c] = Math.Max(headers[c].Length, _rows.Count == 0 ? 0 : _rows.Max(r => r[c].Length));
        var sb = new StringBuilder();
        void Line(string[] cells)
        {
            sb.Append(indent);
            for (int c = 0; c < n; c++)
            {
                string cell = _numeric[c] ? cells[c].PadLeft(width[c]) : cells[c].PadRight(width[c]);
                sb.Append(cell);
                if (c < n - 1) sb.Append("  ");
            }
            sb.Append('\n');
        }
        Line(headers);
        sb.Append(indent).Append(new string('-', width.Sum() + 2 * (n - 1))).Append('\n');
        foreach (var r in _rows) Line(r);
        return sb.ToString();
    }

    /// <summary>Four significant figures; exponent form only for very small or very large magnitudes.</summary>
    public static string Num(double v)
    {
        if (v == 0) return "0";
        if (double.IsNaN(v)) return "n/a";   // undefined (e.g. a centre of rigidity of a story without shear), never "NaN"
        if (!double.IsFinite(v)) return v > 0 ? "inf" : "-inf";
        double a = Math.Abs(v);
        if (a >= 1e-3 && a < 1e7)
        {
            int decimals = Math.Max(0, 3 - (int)Math.Floor(Math.Log10(a)));
            return v.ToString("F" + decimals, CultureInfo.InvariantCulture);
        }
        return v.ToString("0.000E+0", CultureInfo.InvariantCulture);
    }

    public static string Sci(double v) => v.ToString("0.0E+0", CultureInfo.InvariantCulture);
}
