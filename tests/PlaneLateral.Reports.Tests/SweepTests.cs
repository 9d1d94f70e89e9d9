using System.Globalization;
using PlaneLateral.Hand;
using PlaneLateral.Model;
using PlaneLateral.Studies;
using PlaneLateral.Units;
using static PlaneLateral.Reports.Tests.TestSupport;

namespace PlaneLateral.Reports.Tests;

[Collection("current directory")]
public class SweepTests
{
    private static SweepSpec Spec(double from = 0.5, double to = 2.0, int points = 4, SweepSpacing spacing = SweepSpacing.Linear,
        double e = 1800.0, double g = 720.0, IReadOnlyList<EndFixity>? ends = null) =>
        new(from, to, points, spacing, UnitSystem.KipInch, 240, 8, e, g, "test masonry", 1.2,
            ends ?? [EndFixity.Cantilever, EndFixity.FixedFixed], 0.10);

    [Fact]
    public void Linear_and_geometric_spacing_hit_the_ends_and_step_evenly()
    {
        // Derived: linear 0.5..2 in 4 points steps by 0.5; geometric 0.25..4 in 5 points steps by the ratio 2.
        Assert.Equal([0.5, 1.0, 1.5, 2.0], Spec().AspectRatios());
        var geo = Spec(0.25, 4, 5, SweepSpacing.Geometric).AspectRatios();
        double[] expected = [0.25, 0.5, 1, 2, 4];
        for (int i = 0; i < 5; i++) Near(expected[i], geo[i], 1e-12, $"geometric point {i}");
    }

    [Fact]
    public void Hand_values_match_the_masonry_shortcut()
    {
        // Taly, Design of Reinforced Masonry Structures, eqs. 7.1 and 7.12 (G = 0.4E, f = 1.2):
        // cantilever Δ = P/(E t)·[4(h/l)³ + 3(h/l)], fixed-fixed Δ = P/(E t)·[(h/l)³ + 3(h/l)].
        // h/l = 1, E = 1800, t = 8: cantilever k = 14400/7, fixed-fixed k = 14400/4.
        var r = AspectSweep.Run(Spec(1.0, 2.0, 2));
        var cant = r.Points.Single(p => p.Ends == EndFixity.Cantilever && p.AspectRatio == 1.0);
        var ff = r.Points.Single(p => p.Ends == EndFixity.FixedFixed && p.AspectRatio == 1.0);
        Near(14400.0 / 7, cant.Hand.Stiffness, 1e-12, "cantilever hand k");
        Near(14400.0 / 4, ff.Hand.Stiffness, 1e-12, "fixed-fixed hand k");
        // Shear share, derived from the same formula: 3/(4+3) cantilever, 3/(1+3) fixed-fixed.
        Near(3.0 / 7, cant.Hand.ShearShare, 1e-12, "cantilever shear share");
        Near(3.0 / 4, ff.Hand.ShearShare, 1e-12, "fixed-fixed shear share");
        // The exact Timoshenko element reproduces the same beam theory (docs/comparisons.md §2): FE equals hand to 1e-9.
        Near(14400.0 / 7, cant.Fe[0].Value, 1e-9, "cantilever FE k");
        Near(14400.0 / 4, ff.Fe[0].Value, 1e-9, "fixed-fixed FE k");
        Near(3.0 / 7, cant.Fe[0].ShearShare!.Value, 1e-9, "cantilever FE shear share");
    }

    [Fact]
    public void A_sweep_point_equals_the_same_wall_solved_through_the_normal_path()
    {
        // The same wall (h = 1.5·240 = 360 in, l = 240 in, t = 8 in, E = 1800, G = 720, f = 1.2) as a model file with a
        // wall-line check, read by ModelReader and compared by ComparisonStudy: the sweep's point at h/l = 1.5 must give
        // the same hand and FE numbers (derived: same inputs, same formulas; the FE model differs only in its node count).
        string json = $$"""
        {
          "formatVersion": 1,
          "units": { "force": "kip", "length": "in" },
          "materials": [ { "id": "M", "E": 1800.0, "G": 720.0 } ],
          "sections": [ { "id": "W", "shape": "rectangle", "b": 8.0, "d": 240.0, "shearFactor": 1.2 } ],
          "nodes": [ { "id": "A", "x": 0, "y": 0 }, { "id": "B", "x": 0, "y": 180 }, { "id": "C", "x": 0, "y": 360 } ],
          "members": [ { "id": "W1", "start": "A", "end": "B", "section": "W", "material": "M" },
                       { "id": "W2", "start": "B", "end": "C", "section": "W", "material": "M" } ],
          "supports": [ { "node": "A", "type": "fixed" } ],
          "stiffnessAt": [ { "node": "C", "direction": "x" } ],
          "comparisons": [ { "id": "WL", "kind": "wall-line", "members": ["W1", "W2"], "ends": ["cantilever", "fixed-fixed"] } ]
        }
        """;
        var report = ComparisonStudy.Run(ModelReader.Parse(json, "wall.json"));
        var sweep = AspectSweep.Run(Spec());
        foreach (var (ends, subject) in new[] { (EndFixity.Cantilever, "cantilever"), (EndFixity.FixedFixed, "fixed-fixed") })
        {
            var row = report.Rows.Single(r => r.Subject == subject);
            var point = sweep.Points.Single(p => p.Ends == ends && p.AspectRatio == 1.5);
            Near(row.Hand.Value, point.Hand.Stiffness, 1e-12, $"{subject} hand");
            // The sweep here runs the line members alone; the row's line model is its "line members, isolated" estimate
            // (its reference may be a converged panel, which this sweep does not run).
            var line = row.Estimate("line members, isolated")!;
            Near(line.Value, point.Fe[0].Value, 1e-9, $"{subject} FE");
            Near(row.Hand.ShearShare!.Value, point.Hand.ShearShare, 1e-12, $"{subject} hand shear share");
            Near(line.ShearShare!.Value, point.Fe[0].ShearShare!.Value, 1e-9, $"{subject} FE shear share");
            Assert.Equal(ComparisonRow.Judge(line.Value / row.Hand.Value, row.Tolerance), point.Verdict);
            Assert.Equal(1.5, row.AspectRatio);
        }
    }

    private sealed class HalfStiffModel : ISweepFeModel
    {
        public string Name => "half-stiff stand-in";
        public string Description => "the hand stiffness halved, to test the list of FE models";
        public (double Stiffness, double? ShearShare) Solve(SweepWall w) =>
            (0.5 * Piers.Rectangular(w.Ends, 1, w.Height, w.Length, w.Thickness, w.E, w.G, w.FormFactor).Stiffness, null);
    }

    [Fact]
    public void A_second_FE_model_plugs_in_as_one_more_column()
    {
        // Derived: the stand-in gives half the hand stiffness (in SI; the sweep converts to kip/in), so its ratio is 0.5;
        // the reference stays the first model.
        var r = AspectSweep.Run(Spec(), [new LineMemberWallModel(), new HalfStiffModel()]);
        Assert.Equal(["Timoshenko line members", "half-stiff stand-in"], r.FeModels);
        foreach (var p in r.Points)
        {
            Assert.Equal(2, p.Fe.Count);
            Near(0.5, p.Fe[1].Value / p.Hand.Stiffness, 1e-12, "stand-in ratio");
            Assert.Equal(Verdict.WithinTolerance, p.Verdict);
        }
        string csv = SweepFiles.Csv(r, "test");
        Assert.Contains("fe2 stiffness [kip/in],fe2 FE/hand,fe2 shear share", csv);
        Assert.Contains("# fe2: half-stiff stand-in", csv);
    }

    [Fact]
    public void The_sweep_command_writes_a_csv_and_two_pngs_of_the_stated_size()
    {
        string dir = TempDir("sweep");
        var (code, output, err) = Run("sweep", "--points", "6", "--out", dir);
        Assert.True(code == 0, err);
        Assert.Equal("", err);   // stderr is not a terminal here: no progress line (common practice)
        Assert.Equal(["sweep-ratio.png", "sweep-shear-share.png", "sweep.csv"], Directory.GetFiles(dir).Select(f => Path.GetFileName(f)).Order().ToArray());
        foreach (var png in new[] { "sweep-ratio.png", "sweep-shear-share.png" })
            ValidPng(File.ReadAllBytes(Path.Combine(dir, png)), PlotStyle.Width, PlotStyle.Height, png);
        var lines = File.ReadAllLines(Path.Combine(dir, "sweep.csv"));
        Assert.Equal(1 + 12, lines.Count(l => !l.StartsWith('#')));   // header + 6 points × 2 end conditions
        Assert.Contains(lines, l => l.StartsWith("# caution:") && l.Contains("licensed engineer"));
        Assert.Contains("licensed engineer", output);
    }

    [Fact]
    public void The_sweep_output_is_byte_identical_between_two_runs()
    {
        string a = TempDir("sweep-a"), b = TempDir("sweep-b");
        string[] args = ["sweep", "--from", "0.3", "--to", "3", "--points", "40", "--material", "masonry"];
        Assert.Equal(0, Run([.. args, "--out", a]).Code);
        Assert.Equal(0, Run([.. args, "--out", b]).Code);
        foreach (var name in new[] { "sweep.csv", "sweep-ratio.png", "sweep-shear-share.png" })
            Assert.True(File.ReadAllBytes(Path.Combine(a, name)).AsSpan().SequenceEqual(File.ReadAllBytes(Path.Combine(b, name))), $"{name} differs");
    }

    [Theory]
    [InlineData("--from", "2", "--to", "1", "inverted")]
    [InlineData("--from", "1", "--to", "1", "empty")]
    [InlineData("--from", "0", "--to", "1", "not a positive number")]
    [InlineData("--points", "401", "--to", "4", "more than the limit of 400")]
    [InlineData("--points", "1", "--to", "4", "cannot span a range")]
    [InlineData("--material", "steel", "--to", "4", "--material 'steel' is unknown")]
    [InlineData("--units", "kip", "--to", "4", "is not FORCE,LENGTH")]
    public void Bad_sweep_input_is_refused_with_nothing_written(string o1, string v1, string o2, string v2, string message)
    {
        string dir = TempDir("sweep-bad");
        var (code, _, err) = Run("sweep", o1, v1, o2, v2, "--out", dir);
        Assert.Equal(1, code);
        Assert.Contains(message, err);
        Assert.Contains("Fix:", err);
        Assert.Contains("Nothing was written", err);
        Assert.False(Directory.Exists(dir));
    }

    [Fact]
    public void An_output_folder_that_cannot_be_written_gives_exit_4_and_no_files()
    {
        // A folder below a regular file cannot be created (common practice).
        string parent = TempDir("sweep-file");
        Directory.CreateDirectory(parent);
        string blocker = Path.Combine(parent, "a-file");
        File.WriteAllText(blocker, "x");
        var (code, _, err) = Run("sweep", "--points", "3", "--out", Path.Combine(blocker, "out"));
        Assert.Equal(4, code);
        Assert.Contains("cannot create the output folder", err);
        Assert.Equal([blocker], Directory.GetFileSystemEntries(parent));
    }

    [Fact]
    public void A_failed_write_leaves_the_earlier_files_untouched_and_no_partial_files()
    {
        // All files or none (DEVELOPERS.md, Outputs): a folder where sweep-shear-share.png is a directory cannot take
        // that file, so sweep.csv from the earlier run must stay as it was and no temporary file may remain.
        string dir = TempDir("sweep-partial");
        Assert.Equal(0, Run("sweep", "--points", "3", "--out", dir).Code);
        byte[] before = File.ReadAllBytes(Path.Combine(dir, "sweep.csv"));
        File.Delete(Path.Combine(dir, "sweep-shear-share.png"));
        Directory.CreateDirectory(Path.Combine(dir, "sweep-shear-share.png"));
        File.WriteAllText(Path.Combine(dir, "sweep-shear-share.png", "keep"), "x");
        var (code, _, _) = Run("sweep", "--points", "5", "--out", dir);
        Assert.Equal(4, code);
        Assert.Equal(before, File.ReadAllBytes(Path.Combine(dir, "sweep.csv")));
        Assert.DoesNotContain(Directory.GetFiles(dir), f => f.EndsWith(".partial", StringComparison.Ordinal));
    }
}
