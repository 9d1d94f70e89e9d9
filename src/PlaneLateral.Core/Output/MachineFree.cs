using System.Text.RegularExpressions;

namespace PlaneLateral.Output;

/// <summary>
/// Results files depend only on the input (docs/hardening.md, "Same bytes on any machine"): a solver's description as
/// written to them drops what belongs to the machine it ran on — the thread count, the vector width of the kernels,
/// the native library's build string and path — which the console still prints. The numbers do not depend on these:
/// the managed kernels give the same bits scalar or vectorised, and the factor the same bits on any thread count (the
/// determinism tests run the demo with 1 and 2 processors).
/// </summary>
public static partial class MachineFree
{
    /// <summary><paramref name="solverDescription"/> without machine-dependent parts.</summary>
    public static string Solver(string solverDescription)
    {
        string s = ThreadCount().Replace(solverDescription, "");
        s = VectorWidth().Replace(s, "managed kernels");
        s = NativeStatus().Replace(s, "(native dense kernels;");
        return s;
    }

    [GeneratedRegex(@", [0-9]+ threads?")]
    private static partial Regex ThreadCount();

    [GeneratedRegex(@"managed, ([0-9]+-bit vector kernels|scalar kernels)")]
    private static partial Regex VectorWidth();

    [GeneratedRegex(@"\(native dense kernels: [^;]*;")]
    private static partial Regex NativeStatus();
}
