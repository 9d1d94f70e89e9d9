using System.Globalization;
using PlaneLateral.Analysis;
using PlaneLateral.Units;

namespace PlaneLateral.Output;

/// <summary>How a column's cells are written: text, a number, or a fraction shown as a percentage on screen.</summary>
public enum CellKind { Text, Number, Percent }

/// <summary>One column of a <see cref="ResultTable"/>: its name and unit (empty for a ratio or text).</summary>
public sealed record TableColumn(string Name, string Unit = "", CellKind Kind = CellKind.Number)
{
    /// <summary>"name [unit]", or the name alone without a unit.</summary>
    public string Header => Unit.Length == 0 ? Name : $"{Name} [{Unit}]";
}

/// <summary>
/// A results table built once (title, columns with units, rows, notes) and rendered to each output: CSV here (one header
/// row, numbers to 12 significant figures, culture-invariant, text through the one escaper), the console by the command
/// line's table printer. Cells are text (string) or numbers (double, in the table's units). The rows may be produced as
/// they are read (a large results table: <see cref="WriteCsv"/> streams them into a file row by row, never holding the
/// table or its text whole).
/// </summary>
public sealed class ResultTable
{
    public required string Title { get; init; }
    public required IReadOnlyList<TableColumn> Columns { get; init; }
    /// <summary>The rows, in order; a table of computed rows enumerates them afresh each time it is read.</summary>
    public required IEnumerable<IReadOnlyList<object>> Rows { get; init; }
    public IReadOnlyList<string> Notes { get; init; } = [];
    /// <summary>
    /// Lines the CSV file opens with before its header, each written as one <c># text</c> comment (the caution, notes of
    /// how the file was produced): the only thing a results CSV carries besides its one table.
    /// </summary>
    public IReadOnlyList<string> Comments { get; init; } = [];

    /// <summary>The index of the column named <paramref name="name"/>.</summary>
    public int Column(string name)
    {
        for (int i = 0; i < Columns.Count; i++) if (Columns[i].Name == name) return i;
        throw new ArgumentException($"the table \"{Title}\" has no column \"{name}\"", nameof(name));
    }

    /// <summary>The table as CSV text (built in memory: see <see cref="WriteCsv"/> for a large table).</summary>
    public string ToCsv()
    {
        var sw = new StringWriter(CultureInfo.InvariantCulture) { NewLine = "\n" };
        WriteCsv(sw);
        return sw.ToString();
    }

    /// <summary>Writes the table as CSV into <paramref name="w"/>, one row at a time: the header row, then each row.</summary>
    public void WriteCsv(TextWriter w)
    {
        foreach (var comment in Comments) w.Write(CsvText.Comment(comment));
        w.Write(string.Join(",", Columns.Select(c => CsvText.Cell(c.Header))));   // a header holding an id (a level, a line) is escaped like any text cell
        w.Write('\n');
        Span<char> digits = stackalloc char[32];   // "G12" and an int need at most 19 and 11 characters
        foreach (var row in Rows)
        {
            for (int i = 0; i < row.Count; i++)
            {
                if (i > 0) w.Write(',');
                // Numbers are formatted into a buffer, not a string each: a large table writes hundreds of thousands.
                switch (row[i])
                {
                    case double v when !double.IsFinite(v):
                        w.Write("n/a");
                        break;
                    case double v:
                        if (v.TryFormat(digits, out int nd, "G12", CultureInfo.InvariantCulture)) w.Write(digits[..nd]);
                        else w.Write(v.ToString("G12", CultureInfo.InvariantCulture));
                        break;
                    case int k:
                        if (k.TryFormat(digits, out int nk, default, CultureInfo.InvariantCulture)) w.Write(digits[..nk]);
                        else w.Write(k.ToString(CultureInfo.InvariantCulture));
                        break;
                    case var cell:
                        w.Write(CsvText.Cell(cell?.ToString() ?? ""));
                        break;
                }
            }
            w.Write('\n');
        }
    }

    /// <summary>
    /// A cell as the console and the report show it: numbers to four significant figures (fixed between 1e-3 and 1e7,
    /// otherwise scientific), a percentage column as "12.3 %", a non-finite number as "n/a", text as it is.
    /// </summary>
    public static string Display(object? cell, CellKind kind) => cell switch
    {
        int i => i.ToString(CultureInfo.InvariantCulture),
        double v when kind == CellKind.Percent => double.IsFinite(v) ? (100 * v).ToString("0.0", CultureInfo.InvariantCulture) + " %" : "n/a",
        double v => double.IsFinite(v) ? Number(v) : "n/a",
        _ => cell?.ToString() ?? "",
    };

    /// <summary>A number to four significant figures: fixed between 1e-3 and 1e7, scientific otherwise; "0" for zero.</summary>
    public static string Number(double v)
    {
        if (v == 0) return "0";
        if (double.IsNaN(v)) return "n/a";
        if (!double.IsFinite(v)) return v > 0 ? "inf" : "-inf";
        double a = Math.Abs(v);
        if (a >= 1e-3 && a < 1e7)
        {
            int decimals = Math.Max(0, 3 - (int)Math.Floor(Math.Log10(a)));
            return v.ToString("F" + decimals, CultureInfo.InvariantCulture);
        }
        return v.ToString("0.000E+0", CultureInfo.InvariantCulture);
    }
}

/// <summary>The building layer's tables, built once from a run for the console and the files alike.</summary>
public static class BuildingTables
{
    /// <summary>Story results of every case and combination.</summary>
    public static ResultTable Stories(ModelResult run)
    {
        var u = run.Model.Units;
        string len = u.LengthSymbol, fu = u.ForceSymbol, ku = u.Label(Quantity.TranslationalStiffness);
        double L(double v) => u.FromSI(v, Quantity.Length);
        var rows = new List<IReadOnlyList<object>>();
        foreach (var c in run.Building.Cases)
            foreach (var s in c.Stories)
                rows.Add([c.CaseId, c.IsCombination ? "combination" : "load case", s.Index, s.Bottom.Id, s.Top.Id, L(s.Height), L(s.TopDisplacement), L(s.Drift),
                    s.DriftRatio, L(s.CutElevation), u.FromSI(s.Shear, Quantity.Force), u.FromSI(s.Stiffness, Quantity.TranslationalStiffness)]);
        return new ResultTable
        {
            Title = "Stories",
            Columns =
            [
                new("case", Kind: CellKind.Text), new("kind", Kind: CellKind.Text), new("story"), new("bottom level", Kind: CellKind.Text), new("top level", Kind: CellKind.Text),
                new("height", len), new("top displacement", len), new("drift", len), new("drift ratio"), new("cut at y", len), new("story shear", fu), new("story stiffness", ku),
            ],
            Rows = rows,
        };
    }

    /// <summary>Amplified drift against the allowable ratio, every check, case and story.</summary>
    public static ResultTable DriftChecks(ModelResult run)
    {
        var u = run.Model.Units;
        string len = u.LengthSymbol;
        double L(double v) => u.FromSI(v, Quantity.Length);
        var rows = run.Building.DriftChecks.Select(d => (IReadOnlyList<object>)
            [d.Check.Id, d.CaseId, d.Story.Index, L(d.Story.Height), L(d.ElasticDrift), d.Check.Cd, d.Check.Ie, L(d.AmplifiedDrift), d.Ratio, d.Allowed,
             d.Passes ? "within" : "exceeds", d.Margin, d.Check.LimitSource]).ToList();
        return new ResultTable
        {
            Title = "Drift check: amplified drift = Cd·elastic drift / Ie (ASCE 7-16 eq. 12.8-15) against the allowable drift ratio",
            Columns =
            [
                new("check", Kind: CellKind.Text), new("case", Kind: CellKind.Text), new("story"), new("height", len), new("elastic drift", len), new("Cd"), new("Ie"),
                new("amplified drift", len), new("drift ratio"), new("allowed ratio"), new("result", Kind: CellKind.Text), new("margin", Kind: CellKind.Percent),
                new("limit source", Kind: CellKind.Text),
            ],
            Rows = rows,
            Notes = ["margin: share of the allowable drift left. A computed aid, not a code check: the governing code decides."],
        };
    }
}
