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
            t.Add(idx.Select(i => ResultTable.Display(row[i], table.Columns[i].Kind)).ToArray());
        return t.Render();
    }

    /// <summary>Every column of <paramref name="table"/>.</summary>
    public static string Render(ResultTable table, Func<IReadOnlyList<object>, bool>? rows = null) =>
        Render(table, table.Columns.Select(c => c.Name).ToList(), rows);
}
