using System.Text;
using PlaneLateral.Analysis;
using PlaneLateral.Model;
using PlaneLateral.Output;
using PlaneLateral.Tests.Input;

namespace PlaneLateral.Tests.Output;

/// <summary>
/// results.json and the tables that grow with the model (displacements, reactions, member forces) are streamed into their
/// files (docs/hardening.md, "Size limits"): the bytes on disk equal those of the writers that built each file as one
/// string (<see cref="PreviousResultWriters"/>), and a set whose writer fails part-way replaces nothing and leaves no
/// temporary file (the all-or-nothing promise of <see cref="AtomicFiles"/>; common practice for a results set).
/// </summary>
public sealed class StreamedResultFilesTests : IDisposable
{
    private static readonly TimeSpan Guard = TimeSpan.FromSeconds(300);

    private readonly string _dir = Directory.CreateTempSubdirectory("planelateral-stream-").FullName;

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    public static TheoryData<string> SmallModels() =>
    [
        "demo-clinic.json",                              // a building: levels, combinations, a seismic case
        "verification/uniform-five-story-shear-frame.json", // stories and drift checks
        "panels/two-story-wall.json",                    // wall panels: each case's panel base reactions
        "verification/cantilever-wall-kip-in.json",      // kip and inch units, a stiffness point
        "footings/wall-on-footing.json",                 // spring supports
        "panels/masonry-wall-and-frame.json",            // panels beside a frame, a seismic block without the second-order step
    ];

    [Theory]
    [MemberData(nameof(SmallModels))]
    public async Task StreamedFilesHaveTheBytesOfTheStringWriters(string model) => await Task.Run(() =>
    {
        var run = ModelRun.Run(ModelReader.ReadFile(RepositoryFiles.ModelPath(model)));
        var r = run.Analysis;
        var files = ResultFiles.Files(run);
        AtomicFiles.WriteAll(_dir, files);
        byte[] Written(string name) => File.ReadAllBytes(Path.Combine(_dir, name));
        var utf8 = new UTF8Encoding(false);
        Assert.Equal(utf8.GetBytes(PreviousResultWriters.Json(r)), Written("results.json"));
        Assert.Equal(utf8.GetBytes(PreviousResultWriters.Displacements(r)), Written("displacements.csv"));
        Assert.Equal(utf8.GetBytes(PreviousResultWriters.Reactions(r)), Written("reactions.csv"));
        Assert.Equal(utf8.GetBytes(PreviousResultWriters.MemberForces(r)), Written("member-forces.csv"));
        if (files.Any(f => f.Name == "stories.json"))
            Assert.Equal(PreviousResultWriters.StoriesJson(r, run.Building), files.Single(f => f.Name == "stories.json").ToText());
        if (run.Seismic is { } seismic)
            Assert.Equal(PreviousResultWriters.SeismicJson(r, seismic), files.Single(f => f.Name == "seismic.json").ToText());
        if (r.Panels.Count > 0)
            Assert.Equal(PreviousResultWriters.PanelsJson(r), files.Single(f => f.Name == "panels.json").ToText());
        if (run.Spectrum is { } spectrum)
            Assert.Equal(PreviousResultWriters.SpectrumJson(r, spectrum), files.Single(f => f.Name == "response-spectrum.json").ToText());
        // The in-memory form the tests read is the same bytes as the file, every file of the set.
        foreach (var f in files) Assert.Equal(f.ToBytes(), Written(f.Name));
    }).WaitAsync(Guard);

    [Theory]
    [InlineData("demo-clinic.json")]             // wall lines, perforated walls, frames, shear split: shares and details
    [InlineData("footings/wall-on-footing.json")] // a wall on a footing
    public async Task ComparisonsJsonHasTheBytesOfThePropertyWriter(string model) => await Task.Run(() =>
    {
        var m = ModelReader.ReadFile(RepositoryFiles.ModelPath(model));
        var report = PlaneLateral.Studies.ComparisonStudy.Run(m, PlaneLateral.Studies.ComparisonStudy.DefaultTolerance, ModelRun.Run(m));
        Assert.NotEmpty(report.Rows);
        Assert.Equal(PreviousResultWriters.ComparisonsJson(report, "PlaneLateral test"),
            PlaneLateral.Studies.ComparisonFiles.Render(report, "PlaneLateral test").Single(f => f.Name == "comparisons.json").Text);
    }).WaitAsync(Guard);

    [Theory]
    [InlineData("demo-building.json")]               // a building in plan with a seismic block
    [InlineData("plan/long-warehouse.json")]         // floors that bend: the floors block
    [InlineData("plan/walls-with-openings.json")]    // panel lines and named points
    public async Task PlanJsonFilesHaveTheBytesOfTheTreeWriters(string model) => await Task.Run(() =>
    {
        var (r, seismic, _, tributary) = PlaneLateral.Studies.PlanRun.Run(ModelReader.ReadPlanFile(RepositoryFiles.ModelPath(model)));
        Assert.Equal(PreviousResultWriters.PlanJson(r, tributary), PlanFiles.Render(r, tributary).Single(f => f.Name == "plan.json").Text);
        if (seismic is not null)
            Assert.Equal(PreviousResultWriters.PlanSeismicJson(r, seismic), PlanSeismicFiles.Render(r, seismic).Single(f => f.Name == "plan-seismic.json").Text);
    }).WaitAsync(Guard);

    [Fact]
    public async Task AWriterThatFailsPartWayReplacesNothingAndLeavesNoTemporaryFile() => await Task.Run(() =>
    {
        AtomicFiles.WriteAll(_dir, [("results.json", "old results"), ("displacements.csv", "old displacements")]);
        var run = ModelRun.Run(ModelReader.ReadFile(RepositoryFiles.ModelPath("verification/cantilever-wall-kip-in.json")));
        var good = ResultFiles.Files(run);
        // The second file writes a megabyte, then its source fails (as a result that cannot be read would).
        var failing = OutputFile.Streamed("displacements.csv", w =>
        {
            w.Write(new string('x', 1 << 20));
            throw new InvalidOperationException("the rows could not be produced");
        });
        var e = Assert.Throws<InvalidOperationException>(() => AtomicFiles.WriteAll(_dir, [good.Single(f => f.Name == "results.json"), failing]));
        Assert.Equal("the rows could not be produced", e.Message);
        AssertOldSet();
    }).WaitAsync(Guard);

    [Fact]
    public async Task AnIoFailureInsideAStreamedJsonFileReplacesNothing() => await Task.Run(() =>
    {
        AtomicFiles.WriteAll(_dir, [("results.json", "old results"), ("displacements.csv", "old displacements")]);
        // The first file fails half-way through its array, after many objects have gone to its temporary file.
        var doc = new { items = Enumerable.Range(0, 200_000).Select(i => i < 100_000 ? i : throw new IOException("no space left on the device")) };
        var e = Assert.Throws<IOException>(() => AtomicFiles.WriteAll(_dir, [TypedJson.File("results.json", doc), OutputFile.Text("displacements.csv", "new")]));
        Assert.Contains("no space left on the device", e.Message);
        Assert.Contains("cannot write into the output folder", e.Message);
        AssertOldSet();
    }).WaitAsync(Guard);

    private void AssertOldSet()
    {
        Assert.Equal("old results", File.ReadAllText(Path.Combine(_dir, "results.json")));
        Assert.Equal("old displacements", File.ReadAllText(Path.Combine(_dir, "displacements.csv")));
        Assert.Equal(["displacements.csv", "results.json"], Directory.GetFileSystemEntries(_dir).Select(Path.GetFileName).Order(StringComparer.Ordinal));
    }
}
