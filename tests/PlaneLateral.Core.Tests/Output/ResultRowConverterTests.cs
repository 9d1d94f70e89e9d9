using System.Globalization;
using PlaneLateral.Output;
using Xunit;

namespace PlaneLateral.Tests.Output;

/// <summary>
/// The hand-written writer of results.json's rows (<see cref="ResultRowConverter"/>) against the reference library's
/// own reflection-based serialization (Newtonsoft.Json 13, the same settings without the converter): the text must be
/// the same to the byte, for every row type, inside an indented document and with awkward numbers.
/// </summary>
public class ResultRowConverterTests
{
    // Values where a formatting difference would show: round-trip digits, signed zero, tiny and huge magnitudes,
    // whole numbers (written "5.0"), and the non-finite ones (written as strings by these settings).
    private static readonly double[] Awkward =
        [0.1, -0.0, 0.0, 5.0, -2.5e-300, 1.7976931348623157e308, 1.0 / 3.0, 123456789012345.6, double.NaN,
         double.PositiveInfinity, double.NegativeInfinity, 4.9e-324, -1e21, 1e-7];

    private static double A(int i) => Awkward[i % Awkward.Length];

    private static ResultsCase Case(int seed) => new(
        "case-" + seed, "loadCase", seed % 2 == 0 ? null : "with a \"quoted\" description, ü and a tab\t",
        new ResultsCaseChecks(A(seed), A(seed + 1), A(seed + 2), A(seed + 3), A(seed + 4), A(seed + 5), A(seed + 6), A(seed + 7)),
        Enumerable.Range(0, 15).Select(i => new ResultsDisplacement("N" + i, A(i + seed), A(i + seed + 1), A(i + seed + 2))).ToList(),
        Enumerable.Range(0, 15).Select(i => new ResultsReaction(i == 3 ? "node \"3\"\n" : "S" + i, A(i), A(i + 5), A(i + 9))).ToList(),
        seed % 2 == 0 ? null : Enumerable.Range(0, 15).Select(i => new ResultsPanelBase("P" + i, A(i), A(i + 1), A(i + 2), A(i + 3), A(i + 4))).ToList(),
        Enumerable.Range(0, 15).Select(i => new ResultsMemberForces("M" + i, A(i), A(i + 1), A(i + 2), A(i + 3), A(i + 4), A(i + 5))).ToList());

    private static string WithConverter(object value) => TypedJson.Write(value);

    private static string Reference(object value)
    {
        var sw = new StringWriter(CultureInfo.InvariantCulture) { NewLine = "\n" };
        TypedJson.Write(sw, value, TypedJson.Create(rowConverter: false));
        return sw.ToString();
    }

    [Theory]
    [InlineData(0)]
    [InlineData(1)]
    [InlineData(7)]
    public void Every_row_type_is_written_as_the_serializer_writes_it(int seed)
    {
        var document = new[] { Case(seed), Case(seed + 1) };
        string expected = Reference(document);
        Assert.Contains("\"memberForces\"", expected);        // the reference did write the rows
        Assert.Contains("\"momentAboutY\"", expected);
        Assert.Equal(expected, WithConverter(document));
    }

    [Fact]
    public void The_converter_is_used_for_the_rows_and_only_for_them()
    {
        var converter = new ResultRowConverter();
        Assert.True(converter.CanConvert(typeof(ResultsDisplacement)));
        Assert.True(converter.CanConvert(typeof(ResultsReaction)));
        Assert.True(converter.CanConvert(typeof(ResultsPanelBase)));
        Assert.True(converter.CanConvert(typeof(ResultsMemberForces)));
        Assert.False(converter.CanConvert(typeof(ResultsCase)));
        Assert.False(converter.CanConvert(typeof(ResultsCaseChecks)));
        Assert.Contains(TypedJson.Create(rowConverter: true).Converters, c => c is ResultRowConverter);
    }
}
