namespace PlaneLateral.Output;

/// <summary>
/// A results CSV file as the table it is written from: the file's name and its <see cref="ResultTable"/>. Every CSV
/// file of the results is one of these (docs/model-format.md, "CSV files": one table per file), so its bytes are the
/// table's <see cref="ResultTable.WriteCsv"/> and the console and the report can show the same table.
/// </summary>
public sealed record CsvTableFile(string Name, ResultTable Table)
{
    /// <summary>The file, streamed from the table's rows.</summary>
    public OutputFile File() => OutputFile.Streamed(Name, Table.WriteCsv);

    /// <summary>File name and text, built in memory.</summary>
    public (string Name, string Text) Text() => (Name, Table.ToCsv());
}
