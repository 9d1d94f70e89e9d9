using PlaneLateral.Model;

namespace PlaneLateral.Tests.Input;

/// <summary>
/// A file read once through <see cref="ModelReader.ReadSource"/> (the solve and report commands, which take a planar
/// model or a building) gives what the two readers give on the path, and the same messages for a file they refuse
/// (common practice: an optimisation must not change a result or a message).
/// </summary>
public sealed class ModelSourceTests : IDisposable
{
    private static readonly TimeSpan Guard = TimeSpan.FromSeconds(60);
    private readonly string _dir = Directory.CreateTempSubdirectory("planelateral-source-").FullName;

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    public static TheoryData<string> ShippedModels() => [.. RepositoryFiles.Models()];

    [Theory]
    [MemberData(nameof(ShippedModels))]
    public async Task EveryShippedModelReadsAsTheReaderOfItsKindReadsIt(string relative) => await Task.Run(() =>
    {
        string path = RepositoryFiles.ModelPath(relative);
        var source = ModelReader.ReadSource(path);
        Assert.Equal(ModelReader.IsPlanFile(path), source.IsPlan);
        if (source.IsPlan)
        {
            var once = ModelReader.ReadPlan(source);
            var twice = ModelReader.ReadPlanFile(path);
            Assert.Equal(twice.Inputs, once.Inputs);
            Assert.Equal(twice.Warnings, once.Warnings);
            Assert.Equal(twice.FloorCount, once.FloorCount);
            Assert.Equal(twice.Lines.Select(l => l.Id), once.Lines.Select(l => l.Id));
            Assert.Equal(twice.Cases.Select(c => c.Id), once.Cases.Select(c => c.Id));
        }
        else
        {
            var once = ModelReader.Read(source);
            var twice = ModelReader.ReadFile(path);
            Assert.Equal(twice.Inputs, once.Inputs);
            Assert.Equal(twice.Warnings, once.Warnings);
            Assert.Equal(twice.Nodes.Count, once.Nodes.Count);
            Assert.Equal(twice.Members.Count, once.Members.Count);
            Assert.Equal(twice.LoadCases.Select(c => c.Id), once.LoadCases.Select(c => c.Id));
            Assert.Equal(twice.Units, once.Units);
        }
        Assert.Equal(new FileInfo(path).Length, source.Input.Bytes);
    }).WaitAsync(Guard);

    [Theory]
    [InlineData("{\"formatVersion\": 1, \"nodes\": [],}")]                  // trailing comma: not JSON
    [InlineData("{\"formatVersion\": 1, \"plan\": {\"levels\": [}}")]       // a building cut short
    [InlineData("[1, 2]")]                                                  // not an object
    [InlineData("")]                                                        // empty file
    public async Task ARefusedFileGetsTheReadersOwnMessage(string text) => await Task.Run(() =>
    {
        string path = Path.Combine(_dir, "bad.json");
        File.WriteAllText(path, text);
        string expected = Assert.Throws<ModelInputException>(() => ModelReader.ReadFile(path)).Message;
        string actual = Assert.Throws<ModelInputException>(() =>
        {
            var source = ModelReader.ReadSource(path);
            if (source.IsPlan) ModelReader.ReadPlan(source); else ModelReader.Read(source);
        }).Message;
        Assert.Equal(expected, actual);
    }).WaitAsync(Guard);

    [Fact]
    public async Task AMissingFileGetsTheReadersOwnMessage() => await Task.Run(() =>
    {
        string path = Path.Combine(_dir, "missing.json");
        Assert.Equal(Assert.Throws<ModelInputException>(() => ModelReader.ReadFile(path)).Message,
            Assert.Throws<ModelInputException>(() => ModelReader.ReadSource(path)).Message);
    }).WaitAsync(Guard);
}
