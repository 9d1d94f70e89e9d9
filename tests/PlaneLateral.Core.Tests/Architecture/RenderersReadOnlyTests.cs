using System.Reflection;
using System.Reflection.Emit;

namespace PlaneLateral.Tests.Architecture;

/// <summary>
/// The renderers (console tables, results files, the report) only read a run's results: no method of theirs can reach,
/// through any chain of calls inside our assemblies, an entry point that analyses (a static, seismic, second-order, line
/// alone, panel or plan analysis, or a factorisation). Checked on the compiled IL, call by call, so a renderer that
/// starts an analysis through a helper is caught too. (Virtual calls are followed to the method named, not to overrides.)
/// </summary>
public class RenderersReadOnlyTests
{
    /// <summary>Methods that analyse: type full name → method names (every overload).</summary>
    private static readonly Dictionary<string, string[]> Forbidden = new()
    {
        ["PlaneLateral.Analysis.ModelRun"] = ["Run"],
        ["PlaneLateral.Analysis.LinearStaticAnalysis"] = ["Run", "Setup", "Solve", "StiffnessWithLinkedPanels"],
        ["PlaneLateral.Analysis.SeismicAnalysis"] = ["Modal", "Forces", "Prepare", "Stage"],
        ["PlaneLateral.Analysis.SecondOrderAnalysis"] = ["Solve", "CheckStable", "CriticalLoadFactor", "Seismic"],
        ["PlaneLateral.Analysis.SeismicResult"] = ["Of"],
        ["PlaneLateral.Analysis.BuildingResult"] = ["Of"],
        ["PlaneLateral.Analysis.StoryAnalysis"] = ["All", "ForCase"],
        ["PlaneLateral.Analysis.LineAlone"] = ["Stories", "Split", "SplitAll"],
        ["PlaneLateral.Analysis.PanelAnalysis"] = ["Run"],
        ["PlaneLateral.Analysis.PlaneStressAnalysis"] = ["Run"],
        ["PlaneLateral.Analysis.PlanAnalysis"] = ["Run", "Condense"],
        ["PlaneLateral.Analysis.PlanarSpectrum"] = ["Run"],
        ["PlaneLateral.Analysis.PlanSeismic"] = ["Run"],
        ["PlaneLateral.Analysis.PlanModal"] = ["Solve"],
        ["PlaneLateral.Solvers.ISparseSpdSolver"] = ["Factorize"],
        // Computed once into the building's run (PlanRun.Hand, PlanRun.Tributary): a view reads them, never works them out.
        ["PlaneLateral.Studies.PlanHandSplit"] = ["Run"],
        ["PlaneLateral.Studies.PlanTributarySplit"] = ["Run"],
    };

    private static IEnumerable<Type> Renderers()
    {
        var cli = System.Reflection.Assembly.Load("planelateral");
        foreach (var t in cli.GetTypes().Where(t => t.Namespace == "PlaneLateral.Cli" && !t.IsNested && (t.Name.EndsWith("Report", StringComparison.Ordinal) || t.Name is "TextTable" or "Summary")))
            yield return t;
        var core = System.Reflection.Assembly.Load("PlaneLateral.Core");
        foreach (var t in core.GetTypes().Where(t => t.Namespace == "PlaneLateral.Output" && !t.IsNested)) yield return t;
        var reports = System.Reflection.Assembly.Load("PlaneLateral.Reports");
        foreach (var name in new[] { "ModelReport", "ModelPlots", "PanelPlots", "SeismicPlots", "PlanPlots", "PlanFloorPlots", "BuildingReport", "ReportDocument", "FigureNames" })
            if (reports.GetType("PlaneLateral.Reports." + name) is { } t) yield return t;
    }

    [Fact]
    public void NoRendererReachesAnAnalysis()
    {
        var renderers = Renderers().ToList();
        Assert.Contains(renderers, t => t.Name == "SolveReport");
        Assert.Contains(renderers, t => t.Name == "ResultFiles");
        Assert.Contains(renderers, t => t.Name == "ModelReport");
        var bad = new List<string>();
        foreach (var t in renderers)
            foreach (var m in MethodsOf(t))
                if (Reach(m) is { } path) bad.Add(path);
        Assert.True(bad.Count == 0, "renderers that reach an analysis:\n" + string.Join("\n", bad.Distinct()));
    }

    [Fact]
    public void TheCheckFindsTheAnalysesTheCommandsStart()
    {
        // The walk is not blind: the solve and report commands do start a run, and a run reaches a factorisation.
        var cli = System.Reflection.Assembly.Load("planelateral");
        var commands = MethodsOf(cli.GetType("PlaneLateral.Cli.CliApp")!).Concat(MethodsOf(cli.GetType("PlaneLateral.Cli.ReportCommand")!));
        Assert.Contains(commands, m => Reach(m) is { } p && p.Contains("ModelRun.Run"));
        var run = typeof(PlaneLateral.Analysis.ModelRun).GetMethod("Run")!;
        Assert.Contains("ISparseSpdSolver.Factorize", Reach(run, stopAtFirst: false) ?? "");
    }

    [Fact]
    public void OnlyTheRunOptionsPickTheDefaultSolver()
    {
        // The solver the user chose is used everywhere: the default stands in for it in one place only (AnalysisOptions.ForRun).
        var create = typeof(PlaneLateral.Solvers.DefaultSolver).GetMethod("Create")!;
        var callers = new List<string>();
        foreach (var asm in new[] { "PlaneLateral.Core", "PlaneLateral.Studies", "PlaneLateral.Reports", "planelateral" })
            foreach (var t in System.Reflection.Assembly.Load(asm).GetTypes())
                foreach (var m in MethodsOf(t, nested: false))
                    if (Calls(m).Any(c => c == create)) callers.Add($"{t.FullName}.{m.Name}");
        Assert.Equal(["PlaneLateral.Analysis.AnalysisOptions.ForRun"], callers.Distinct().ToArray());
    }

    private static IEnumerable<MethodBase> MethodsOf(Type t, bool nested = true)
    {
        const BindingFlags all = BindingFlags.Public | BindingFlags.NonPublic | BindingFlags.Static | BindingFlags.Instance | BindingFlags.DeclaredOnly;
        foreach (var m in t.GetMethods(all)) yield return m;
        foreach (var c in t.GetConstructors(all)) yield return c;
        if (nested)
            foreach (var n in t.GetNestedTypes(BindingFlags.Public | BindingFlags.NonPublic))
                foreach (var m in MethodsOf(n)) yield return m;
    }

    private static bool IsForbidden(MethodBase m) =>
        m.DeclaringType is { } t && Forbidden.TryGetValue(t.FullName ?? "", out var names) && names.Contains(m.Name);

    private static string Name(MethodBase m) => $"{m.DeclaringType?.Name}.{m.Name}";

    /// <summary>A call path from <paramref name="start"/> to a forbidden method inside our assemblies, or null.</summary>
    private static string? Reach(MethodBase start, bool stopAtFirst = true)
    {
        var seen = new HashSet<MethodBase>();
        var queue = new Queue<(MethodBase M, string Path)>();
        queue.Enqueue((start, Name(start)));
        seen.Add(start);
        string? found = null;
        while (queue.Count > 0)
        {
            var (m, path) = queue.Dequeue();
            foreach (var c in Calls(m))
            {
                if (IsForbidden(c))
                {
                    found = $"{path} → {Name(c)}";
                    if (stopAtFirst || c.DeclaringType == typeof(PlaneLateral.Solvers.ISparseSpdSolver)) return found;
                }
                if (c.DeclaringType?.Assembly.GetName().Name is not { } a || !(a.StartsWith("PlaneLateral", StringComparison.Ordinal) || a == "planelateral")) continue;
                if (seen.Add(c)) queue.Enqueue((c, $"{path} → {Name(c)}"));
            }
        }
        return stopAtFirst ? null : found;
    }

    private static readonly Dictionary<short, OpCode> OpCodesByValue = typeof(OpCodes).GetFields(BindingFlags.Public | BindingFlags.Static)
        .Select(f => (OpCode)f.GetValue(null)!).ToDictionary(o => o.Value);

    /// <summary>Every method a method's IL names (call, callvirt, newobj, ldftn, ldvirtftn), resolved where it can be.</summary>
    private static IEnumerable<MethodBase> Calls(MethodBase m)
    {
        if (m is MethodInfo { IsGenericMethod: true, IsGenericMethodDefinition: false } g) m = g.GetGenericMethodDefinition();
        byte[]? il;
        try { il = m.GetMethodBody()?.GetILAsByteArray(); } catch (Exception e) when (e is InvalidOperationException or NotSupportedException) { il = null; }
        if (il is null) yield break;
        var typeArgs = m.DeclaringType is { IsGenericType: true } dt ? dt.GetGenericArguments() : null;
        var methodArgs = m is MethodInfo { IsGenericMethod: true } mi ? mi.GetGenericArguments() : null;
        int i = 0;
        while (i < il.Length)
        {
            short value = il[i] == 0xFE ? (short)(0xFE00 | il[i + 1]) : il[i];
            i += il[i] == 0xFE ? 2 : 1;
            if (!OpCodesByValue.TryGetValue(value, out var op)) yield break;   // unknown byte: stop rather than misread
            int size = op.OperandType switch
            {
                OperandType.InlineNone => 0,
                OperandType.ShortInlineBrTarget or OperandType.ShortInlineI or OperandType.ShortInlineVar => 1,
                OperandType.InlineVar => 2,
                OperandType.InlineI8 or OperandType.InlineR => 8,
                OperandType.InlineSwitch => 4 + 4 * BitConverter.ToInt32(il, i),
                _ => 4,
            };
            if (op.OperandType == OperandType.InlineMethod)
            {
                MethodBase? target = null;
                try { target = m.Module.ResolveMethod(BitConverter.ToInt32(il, i), typeArgs, methodArgs); }
                catch (Exception e) when (e is ArgumentException or BadImageFormatException or TypeLoadException or MissingMethodException) { }
                if (target is not null) yield return target is MethodInfo { IsGenericMethod: true, IsGenericMethodDefinition: false } tg ? tg.GetGenericMethodDefinition() : target;
            }
            i += size;
        }
    }
}
