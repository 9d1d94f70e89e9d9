using PlaneLateral.Output;

namespace PlaneLateral.Reports;

/// <summary>
/// A <see cref="ResultTable"/> as a report table: the same table the CSV file and the console are written from, its cells
/// shown as on the console (<see cref="ResultTable.Display"/>), its number columns right-aligned.
/// </summary>
public static class ReportTables
{
    /// <summary>
    /// The report table of <paramref name="table"/>: the chosen <paramref name="columns"/> (every column when null) and
    /// rows (every row when <paramref name="rows"/> is null), captioned <paramref name="caption"/> (the table's title when null).
    /// </summary>
    public static Table From(ResultTable table, string? caption = null, IReadOnlyList<string>? columns = null, Func<IReadOnlyList<object>, bool>? rows = null)
    {
        var idx = (columns ?? table.Columns.Select(c => c.Name).ToList()).Select(table.Column).ToArray();
        var body = table.Rows.Where(r => rows?.Invoke(r) ?? true)
            .Select(r => (IReadOnlyList<string>)idx.Select(i => ResultTable.Display(r[i], table.Columns[i].Kind)).ToArray()).ToList();
        return new Table(caption ?? table.Title, idx.Select(i => table.Columns[i].Header).ToArray(), body,
            Enumerable.Range(0, idx.Length).Where(k => table.Columns[idx[k]].Kind != CellKind.Text).ToArray());
    }
}
