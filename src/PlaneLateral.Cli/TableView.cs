using System.Globalization;
using PlaneLateral.Output;

namespace PlaneLateral.Cli;

/// <summary>A <see cref="ResultTable"/> on the console: chosen columns and rows, four significant figures, fitted by <see cref="TextTable"/>.</summary>
internal static class TableView
{
    public static string Render(ResultTable table, IReadOnlyList<string> columns, Func<IReadOnlyList<object>, bool>? rows = null)
    {
        var idx = columns.Select(table.Column).ToArray();
        var t = new TextTable(idx.Select(i => table.Columns[i].Header).ToArray())
            .Numeric(Enumerable.Range(0, idx.Length).Where(k => table.Columns[idx[k]].Kind != CellKind.Text).ToArray());
        foreach (var row in table.Rows.Where(r => rows?.Invoke(r) ?? true))
            t.Add(idx.Select(i => Cell(row[i], table.Columns[i].Kind)).ToArray());
        return t.Render();
    }

    private static string Cell(object cell, CellKind kind) => cell switch
    {
        int i => i.ToString(CultureInfo.InvariantCulture),
        double v when kind == CellKind.Percent => double.IsFinite(v) ? (100 * v).ToString("0.0", CultureInfo.InvariantCulture) + " %" : "n/a",
        double v => double.IsFinite(v) ? TextTable.Num(v) : "n/a",
        _ => cell?.ToString() ?? "",
    };
}
