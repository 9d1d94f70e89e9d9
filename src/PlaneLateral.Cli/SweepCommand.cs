using System.CommandLine;
using System.Globalization;
using PlaneLateral.Hand;
using PlaneLateral.Output;
using PlaneLateral.Reports;
using PlaneLateral.Units;

namespace PlaneLateral.Cli;

/// <summary>The "sweep" command: a solid wall's aspect ratio varied over a range, hand pier formula beside the FE at every point.</summary>
internal static class SweepCommand
{
    public static Command Build(TextWriter stdout, TextWriter stderr)
    {
        var from = new Option<double>("--from") { Description = "Smallest aspect ratio h/l (> 0).", DefaultValueFactory = _ => 0.25 };
        var to = new Option<double>("--to") { Description = "Largest aspect ratio h/l (> --from).", DefaultValueFactory = _ => 4.0 };
        var points = new Option<int>("--points") { Description = $"Number of h/l values, 2 to {AspectSweep.MaxPoints}.", DefaultValueFactory = _ => 25 };
        var spacing = new Option<string>("--spacing") { Description = "linear (equal steps) or geometric (equal ratios).", DefaultValueFactory = _ => "geometric" };
        var ends = new Option<string>("--ends") { Description = "cantilever, fixed-fixed or both.", DefaultValueFactory = _ => "both" };
        var units = new Option<string>("--units") { Description = "Force and length units as FORCE,LENGTH, e.g. kip,in or kN,m.", DefaultValueFactory = _ => "kip,in" };
        var material = new Option<string>("--material") { Description = $"Named material: {string.Join(" or ", SweepMaterials.Names)}. --E, --G, --nu override it.", DefaultValueFactory = _ => "concrete" };
        var e = new Option<double?>("--E") { Description = "Young's modulus in FORCE/LENGTH² (overrides the material)." };
        var g = new Option<double?>("--G") { Description = "Shear modulus in FORCE/LENGTH² (overrides the material)." };
        var nu = new Option<double?>("--nu") { Description = "Poisson's ratio; G = E/(2(1+ν)) (instead of --G)." };
        var length = new Option<double?>("--length") { Description = "Wall plan length l in LENGTH. Default 20 ft in the chosen unit." };
        var thickness = new Option<double?>("--thickness") { Description = "Wall thickness t in LENGTH. Default 8 in in the chosen unit." };
        var shearFactor = new Option<double>("--shear-factor") { Description = "Shear form factor f ≥ 1, shear area A/f.", DefaultValueFactory = _ => ShearForm.RectangleDefault };
        var tol = new Option<string?>("--tolerance") { Description = "Band on FE/hand − 1, as 0.10 or 10%. Default 0.10." };
        var openingWidth = new Option<double?>("--opening-width") { Description = "Width of one centred window as a fraction of the wall length l, in (0, 1); give with --opening-height. Hand value: the perforated-wall method; FE: the panel with the window and the equivalent frame." };
        var openingHeight = new Option<double?>("--opening-height") { Description = "Height of the centred window as a fraction of the wall height h, in (0, 1); give with --opening-width." };
        var footingLength = new Option<double?>("--footing-length") { Description = "Plan length of a footing under the wall, along the wall, in LENGTH (≥ the wall length). With --footing-width and --soil-shear-modulus: the FE wall stands on the footing's springs (Pais & Kausel), the hand pier formula keeps its fixed base, so FE/hand shows where ignoring the footing's rocking fails. Line members only." };
        var footingWidth = new Option<double?>("--footing-width") { Description = "Plan width of the footing across the wall, in LENGTH." };
        var footingEmbedment = new Option<double>("--footing-embedment") { Description = "Depth of the footing's base below grade, in LENGTH.", DefaultValueFactory = _ => 0 };
        var soilG = new Option<double?>("--soil-shear-modulus") { Description = "Soil shear modulus G under the footing, in FORCE/LENGTH² (strain-compatible)." };
        var soilNu = new Option<double>("--soil-poisson") { Description = "Soil Poisson's ratio, in (0, 0.5).", DefaultValueFactory = _ => 0.35 };
        var noPanel = new Option<bool>("--no-panel") { Description = "Leave out the plane-stress panel (faster); the Timoshenko line members become the reference." };
        var outOption = new Option<string?>("--out", "-o") { Description = "Folder for sweep.csv, sweep-ratio.png and sweep-shear-share.png. Default planelateral-results/sweep." };
        var cmd = new Command("sweep",
            "Vary a wall's aspect ratio h/l over a range, for cantilever and fixed-fixed ends, and set the hand formula (the pier formula, flexural, shear and total; with --opening-width and --opening-height, the perforated-wall method) beside the converged plane-stress panel and the Timoshenko line model at every point; write a CSV and two PNG figures.")
        {
            from, to, points, spacing, ends, units, material, e, g, nu, length, thickness, shearFactor, tol, openingWidth, openingHeight, noPanel, outOption,
            footingLength, footingWidth, footingEmbedment, soilG, soilNu,
        };
        cmd.SetAction(p =>
        {
            var o = new SweepArgs(p.GetValue(from), p.GetValue(to), p.GetValue(points), p.GetValue(spacing)!, p.GetValue(ends)!,
                p.GetValue(units)!, p.GetValue(material)!, p.GetValue(e), p.GetValue(g), p.GetValue(nu), p.GetValue(length),
                p.GetValue(thickness), p.GetValue(shearFactor), p.GetValue(tol), p.GetValue(outOption)) { NoPanel = p.GetValue(noPanel), OpeningWidth = p.GetValue(openingWidth), OpeningHeight = p.GetValue(openingHeight),
                FootingLength = p.GetValue(footingLength), FootingWidth = p.GetValue(footingWidth), FootingEmbedment = p.GetValue(footingEmbedment),
                SoilShearModulus = p.GetValue(soilG), SoilPoisson = p.GetValue(soilNu) };
            return Run(o, stdout, stderr);
        });
        return cmd;
    }

    internal sealed record SweepArgs(double From, double To, int Points, string Spacing, string Ends, string Units, string Material,
        double? E, double? G, double? Nu, double? Length, double? Thickness, double ShearFactor, string? Tolerance, string? Out)
    {
        /// <summary>True: the line members only (no plane-stress panel).</summary>
        public bool NoPanel { get; init; }

        /// <summary>The centred window's width over the wall length, or null (solid wall).</summary>
        public double? OpeningWidth { get; init; }

        /// <summary>The centred window's height over the wall height, or null (solid wall).</summary>
        public double? OpeningHeight { get; init; }

        public SweepOpening? Opening => OpeningWidth is double w && OpeningHeight is double h ? new SweepOpening(w, h) : null;

        public double? FootingLength { get; init; }
        public double? FootingWidth { get; init; }
        public double FootingEmbedment { get; init; }
        public double? SoilShearModulus { get; init; }
        public double SoilPoisson { get; init; } = 0.35;

        /// <summary>The footing, when its length, width and soil modulus are all given.</summary>
        public SweepFooting? Footing => FootingLength is double fl && FootingWidth is double fw && SoilShearModulus is double sg
            ? new SweepFooting(fl, fw, FootingEmbedment, sg, SoilPoisson) : null;

        public IReadOnlyList<ISweepFeModel> Models() => Footing is not null ? AspectSweep.DefaultModels(panel: false) : AspectSweep.DefaultModels(Opening, panel: !NoPanel);
    }

    /// <summary>Turns the command line into a spec, listing every problem at once.</summary>
    internal static SweepSpec? ToSpec(SweepArgs a, List<string> problems)
    {
        var parts = a.Units.Split(',', StringSplitOptions.TrimEntries);
        UnitSystem u = UnitSystem.KipInch;
        if (parts.Length != 2 || !UnitSystem.TryParseForce(parts[0], out var fu) || !UnitSystem.TryParseLength(parts[1], out var lu))
            problems.Add($"--units '{a.Units}' is not FORCE,LENGTH. Fix: give e.g. kip,in or kN,m (force: {string.Join(", ", UnitSystem.ForceSymbols)}; length: {string.Join(", ", UnitSystem.LengthSymbols)}).");
        else u = new UnitSystem(fu, lu);

        SweepSpacing spacing = SweepSpacing.Geometric;
        if (a.Spacing == "linear") spacing = SweepSpacing.Linear;
        else if (a.Spacing != "geometric") problems.Add($"--spacing '{a.Spacing}' is unknown. Fix: give linear or geometric.");

        EndFixity[] ends = a.Ends switch
        {
            "both" => [EndFixity.Cantilever, EndFixity.FixedFixed],
            "cantilever" => [EndFixity.Cantilever],
            "fixed-fixed" => [EndFixity.FixedFixed],
            _ => [],
        };
        if (ends.Length == 0) problems.Add($"--ends '{a.Ends}' is unknown. Fix: give cantilever, fixed-fixed or both.");

        var mat = SweepMaterials.Get(a.Material, u);
        if (mat is null) problems.Add($"--material '{a.Material}' is unknown. Fix: give {string.Join(" or ", SweepMaterials.Names)}, or give --E with --G or --nu.");
        if (a.G is not null && a.Nu is not null) problems.Add("--G and --nu are both given. Fix: give one of them.");
        if (a.Nu is double n && !(n > -1 && n < 0.5)) problems.Add($"--nu {n.ToString(CultureInfo.InvariantCulture)} is outside (-1, 0.5). Fix: give a Poisson's ratio such as 0.2.");
        double eVal = a.E ?? mat?.E ?? double.NaN;
        double gVal = a.G ?? (a.Nu is double nn ? eVal / (2 * (1 + nn)) : a.E is not null && mat is not null ? eVal * mat.G / mat.E : mat?.G ?? double.NaN);
        string matName = a.E is null && a.G is null && a.Nu is null ? mat?.Name ?? a.Material
            : $"user values{(mat is null ? "" : $" (starting from {a.Material})")}{(a.G is null && a.Nu is null ? ", G in the material's G/E ratio" : "")}";

        if (!CompareCommand.TryTolerance(a.Tolerance, out double tol, out string tolError)) problems.Add(tolError);
        double len = a.Length ?? u.FromSI(240 * 0.0254, Quantity.Length);
        double t = a.Thickness ?? u.FromSI(8 * 0.0254, Quantity.Length);
        if ((a.OpeningWidth is null) != (a.OpeningHeight is null))
            problems.Add($"{(a.OpeningWidth is null ? "--opening-height" : "--opening-width")} is given without {(a.OpeningWidth is null ? "--opening-width" : "--opening-height")}. Fix: give both, e.g. --opening-width 0.3 --opening-height 0.4, or neither for the solid wall.");
        int footingKeys = (a.FootingLength is null ? 0 : 1) + (a.FootingWidth is null ? 0 : 1) + (a.SoilShearModulus is null ? 0 : 1);
        if (footingKeys is 1 or 2)
            problems.Add("a footing needs --footing-length, --footing-width and --soil-shear-modulus together. Fix: give all three (and optionally --footing-embedment, --soil-poisson), or none for a fixed base.");
        var spec = new SweepSpec(a.From, a.To, a.Points, spacing, u, len, t, eVal, gVal, matName, a.ShearFactor, ends, tol) { Opening = a.Opening, Footing = a.Footing };
        if (problems.Count == 0) problems.AddRange(AspectSweep.Problems(spec, a.Models()));
        return problems.Count == 0 ? spec : null;
    }

    internal static int Run(SweepArgs a, TextWriter stdout, TextWriter stderr)
    {
        var problems = new List<string>();
        var spec = ToSpec(a, problems);
        PhaseTimes.Mark("command line, sweep spec");   // off unless PLANELATERAL_PHASES is set
        if (spec is null)
        {
            foreach (var p in problems) stderr.Write($"sweep: {p}\n");
            stderr.Write("Nothing was written.\n");
            return ExitCodes.Usage;
        }
        int total = spec.Points * spec.Ends.Count;
        // Progress only for a person watching: stderr is the console and a terminal.
        bool terminal = ReferenceEquals(stderr, Console.Error) && !Console.IsErrorRedirected;
        var progress = terminal ? new TerminalProgress(stderr, total) : null;
        // The drawing library's one-time start beside the points, not after them (off the run's critical path); begun
        // already while the command line was read when the program was started for a sweep (StartWarmUp).
        var warmUp = StartWarmUp();
        var result = AspectSweep.Run(spec, a.Models(), progress);
        progress?.Finish();
        PhaseTimes.Mark("points");
        try { warmUp.Wait(); }
        catch (AggregateException) { /* nothing drawn was kept: the figures below meet the same fault and report it */ }
        PhaseTimes.Mark("drawing library ready");

        string folder = a.Out ?? Path.Combine(Directory.GetCurrentDirectory(), "planelateral-results", "sweep");
        // Each file is made on its own task (the two figures on both processors at once); the console text is set while
        // they draw, and each file is written as soon as its bytes are ready, the CSV first. The text is printed only
        // once every file is in place, as before.
        var files = SweepFiles.Start(result, $"PlaneLateral {ResultFiles.Version}");
        var text = new StringWriter { NewLine = "\n" };
        Summary(a, spec, result, text);
        IReadOnlyList<string> written;
        try
        {
            written = AtomicFiles.WriteAll(folder, files.Select(f => OutputFile.Bytes(f.Name, f.Bytes)).ToArray());
        }
        catch (IOException ex)
        {
            stderr.Write($"{ex.Message}\nFix: choose a writable folder with --out. No sweep file was replaced.\n");
            return ExitCodes.OutputFailed;
        }
        PhaseTimes.Mark("figures, CSV, files written");
        stdout.Write(text.ToString());
        stdout.Write($"\nSweep written to {folder}: {string.Join(", ", written.Select(Path.GetFileName))}\n");
        PhaseTimes.Mark("console text");
        return ExitCodes.Success;
    }

    private static Task? s_warmUp;

    /// <summary>
    /// The drawing library's one-time start (<see cref="SweepFiles.WarmUp"/>) on a pool thread, begun once per process;
    /// later calls return the same task.
    /// </summary>
    internal static Task StartWarmUp() => LazyInitializer.EnsureInitialized(ref s_warmUp, () => Task.Run(SweepFiles.WarmUp));

    /// <summary>
    /// Called first thing in the program: when it was started for a sweep (and not for its help), begins the drawing
    /// library's start at once, on the second processor, while the first reads the command line and sets up the sweep
    /// (otherwise idle time of a two-processor run). Any other command loads no drawing code here.
    /// </summary>
    internal static void StartWarmUpEarly(string[] args)
    {
        if (args.Length > 0 && args[0] == "sweep" && !args.Any(x => x is "-h" or "--help" or "-?" or "/?" or "/h"))
            StartWarmUp();
    }

    /// <summary>The sweep's console text, all but the closing line that names the files written.</summary>
    private static void Summary(SweepArgs a, SweepSpec spec, SweepResult result, TextWriter o)
    {
        var u = spec.Units;
        o.Write(spec.Opening is null ? $"PlaneLateral {ResultFiles.Version}: aspect-ratio sweep of a solid wall\n\n"
            : $"PlaneLateral {ResultFiles.Version}: aspect-ratio sweep of a wall with {spec.Opening.Words}\n\n");
        o.Write($"Wall      l = {spec.Length.ToString("G6", CultureInfo.InvariantCulture)} {u.LengthSymbol}, t = {spec.Thickness.ToString("G6", CultureInfo.InvariantCulture)} {u.LengthSymbol}, f = {spec.FormFactor.ToString("G4", CultureInfo.InvariantCulture)}\n");
        o.Write($"Material  {spec.MaterialName}: E = {spec.E.ToString("G6", CultureInfo.InvariantCulture)}, G = {spec.G.ToString("G6", CultureInfo.InvariantCulture)} {u.Label(Quantity.Stress)}\n");
        if (spec.Footing is { } ft) o.Write($"Footing   {ft.Words(u)}; FE on its springs, hand = the fixed-base pier formula (FE/hand below 1: the footing's flexibility the hand ignores)\n");
        o.Write($"Range     h/l {spec.From.ToString("G6", CultureInfo.InvariantCulture)} to {spec.To.ToString("G6", CultureInfo.InvariantCulture)}, {spec.Points} points ({a.Spacing}), {string.Join(" and ", spec.Ends.Select(SweepFiles.EndsName))}\n\n");
        bool two = result.FeModels.Count > 1;
        var t = two
            ? new TextTable("ends", "h/l", "hand k", "FE k", "est. error", "FE/hand", "FE/flexure", "line FE/hand", "shear share (hand)", "verdict").Numeric(1, 2, 3, 4, 5, 6, 7, 8)
            : new TextTable("ends", "h/l", "hand k", "FE k", "FE/hand", "FE/flexure", "shear share (hand)", "verdict").Numeric(1, 2, 3, 4, 5, 6);
        string R(double v) => v.ToString("0.0000", CultureInfo.InvariantCulture);
        foreach (var p in result.Points)
        {
            var cells = new List<string> { SweepFiles.EndsName(p.Ends), p.AspectRatio.ToString("0.000", CultureInfo.InvariantCulture), TextTable.Num(p.Hand.Stiffness), TextTable.Num(p.Fe[0].Value) };
            if (two) cells.Add(p.FeErrors.Count > 0 && p.FeErrors[0] is double err ? (100 * err).ToString("0.000", CultureInfo.InvariantCulture) + "%" : "-");
            cells.Add(R(p.Ratio));
            cells.Add(R(SweepDepartures.Ratio(p, SweepHandFormula.FlexureOnly)));
            if (two) cells.Add(R(p.Fe[1].Value / p.Hand.Stiffness));
            cells.Add((100 * p.Hand.ShearShare).ToString("0.0", CultureInfo.InvariantCulture) + "%");
            cells.Add(Studies.ComparisonRow.VerdictWords(p.Verdict, Studies.ComparedQuantity.Stiffness));
            t.Add([.. cells]);
        }
        o.Write($"Stiffness in {u.Label(Quantity.TranslationalStiffness)}; FE = {result.FeModels[0]} (the reference){(two ? $"; line = {result.FeModels[1]}" : "")}{(spec.Opening is null ? "" : "; hand = the perforated-wall method, FE/flexure = FE over the method without shear deformation")}\n");
        o.Write(t.Render());
        o.Write("\nWhere each hand formula leaves the tolerance band of the reference:\n");
        foreach (var d in SweepDepartures.Find(result)) o.Write($"  {d.Words(spec.From, spec.To)}\n");
        o.Write($"\nCaution: {SweepFiles.Caution}\n");
    }

    /// <summary>"sweep: 12 of 50 points" on one terminal line, rewritten in place.</summary>
    private sealed class TerminalProgress(TextWriter stderr, int total) : IProgress<int>
    {
        private readonly Lock _gate = new();
        private int _shown;

        public void Report(int done)
        {
            lock (_gate)
            {
                // Rewrite the line only when the whole percentage changes (or at the end), not for every point.
                if (done <= _shown || (100L * done / total == 100L * _shown / total && done < total)) return;
                _shown = done;
                stderr.Write($"\rsweep: {done} of {total} points");
            }
        }

        public void Finish()
        {
            lock (_gate) stderr.Write("\r" + new string(' ', 40) + "\r");
        }
    }
}
