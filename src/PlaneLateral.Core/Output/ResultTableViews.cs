namespace PlaneLateral.Output;

/// <summary>Views of a <see cref="ResultTable"/>: the same title, columns and notes over chosen rows in a chosen order (a console or report view of a file's table).</summary>
public static class ResultTableViews
{
    /// <summary>The table over <paramref name="rows"/> applied to its rows (a filter, an order), read afresh each time, as the table's own rows are.</summary>
    public static ResultTable WithRows(this ResultTable table, Func<IEnumerable<IReadOnlyList<object>>, IEnumerable<IReadOnlyList<object>>> rows) => new()
    {
        Title = table.Title,
        Columns = table.Columns,
        Rows = new Deferred(() => rows(table.Rows)),
        Notes = table.Notes,
        Comments = table.Comments,
    };

    private sealed class Deferred(Func<IEnumerable<IReadOnlyList<object>>> rows) : IEnumerable<IReadOnlyList<object>>
    {
        public IEnumerator<IReadOnlyList<object>> GetEnumerator() => rows().GetEnumerator();
        System.Collections.IEnumerator System.Collections.IEnumerable.GetEnumerator() => GetEnumerator();
    }
}
