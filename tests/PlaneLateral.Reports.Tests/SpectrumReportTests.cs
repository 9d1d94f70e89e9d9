using PlaneLateral.Analysis;
using PlaneLateral.Model;
using static PlaneLateral.Reports.Tests.TestSupport;

namespace PlaneLateral.Reports.Tests;

/// <summary>The planar report's modal response spectrum part (the shipped uniform five-story shear frame) and its figures.</summary>
public class SpectrumReportTests
{
    private static string FramePath => Path.Combine(AppContext.BaseDirectory, "models", "verification", "uniform-five-story-shear-frame.json");

    private static ModelResult Run() => ModelRun.Run(ModelReader.ReadFile(FramePath));

    /// <summary>Common practice for reproducible documents: the same input draws the same bytes, so a report can be
    /// compared file by file between runs (headless rendering, no clock or random state in the figure).</summary>
    [Fact]
    public void SpectrumFiguresAreByteIdenticalTwice()
    {
        var a = Run();
        var b = Run();
        var s = a.Spectrum!;
        var periods = s.Modes.Select(m => m.Period).ToList();
        var pairs = new[]
        {
            (SpectrumPlots.Spectrum(s.Spectrum, periods), SpectrumPlots.Spectrum(b.Spectrum!.Spectrum, b.Spectrum.Modes.Select(m => m.Period).ToList())),
            (SpectrumPlots.ModeShapes(a.Model, s), SpectrumPlots.ModeShapes(b.Model, b.Spectrum)),
            (SpectrumPlots.StoryShears(a.Model, s), SpectrumPlots.StoryShears(b.Model, b.Spectrum)),
        };
        foreach (var (x, y) in pairs)
        {
            ValidPng(x.Png, PlotStyle.Width, PlotStyle.Height, x.FileName);
            Assert.True(x.Png.AsSpan().SequenceEqual(y.Png), $"{x.FileName}: two renderings differ");
        }
        // A building's report passes its own spectrum and periods (any number, any labels): a table spectrum too.
        var table = new DesignSpectrum([(0.0, 0.4), (0.2, 1.0), (0.8, 1.0), (3.0, 0.2)]);
        var f = SpectrumPlots.Spectrum(table, [1.1, 0.9, 0.35], ["1 (x)", "2 (y)", "3 (torsion)"], "building-spectrum.png");
        Assert.Equal("building-spectrum.png", f.FileName);
        ValidPng(f.Png, PlotStyle.Width, PlotStyle.Height, f.FileName);
        Assert.True(f.Png.AsSpan().SequenceEqual(SpectrumPlots.Spectrum(table, [1.1, 0.9, 0.35], ["1 (x)", "2 (y)", "3 (torsion)"], "building-spectrum.png").Png));
    }

    [Fact]
    public void ReportHoldsTheSpectrumTablesAndFigures()
    {
        var run = Run();
        var doc = ModelReport.Build(run, null, "uniform-five-story-shear-frame.json", "test");
        foreach (var caption in new[] { "Modal response spectrum: modes", "Modal response spectrum: story shear and overturning", "Modal response spectrum: drift check on the modal drifts",
                     "Modal response spectrum: θ beside the ELF θ", "Modal response spectrum: support reactions", "Modal response spectrum: member end forces" })
            Assert.Contains(doc.Tables, t => t.Caption.StartsWith(caption, StringComparison.Ordinal));
        var files = doc.Blocks.OfType<FigureBlock>().Select(x => x.Figure.FileName).ToList();
        Assert.Contains(SpectrumPlots.SpectrumFile, files);
        Assert.Contains(SpectrumPlots.ShapesFile, files);
        Assert.Contains(SpectrumPlots.ShearFile, files);
        string md = doc.Markdown();
        Assert.Contains(run.Spectrum!.Scaling.Why, md);   // which scaling applied and why
        Assert.Contains("without sign", md);
        // The drift table is fed from the combined modal drifts: one row per story, the story's δ/h as in Core.
        var drift = doc.Tables.Single(t => t.Caption.StartsWith("Modal response spectrum: drift check", StringComparison.Ordinal));
        Assert.Equal(run.Spectrum.Stories.Count, drift.Rows.Count);
    }
}
