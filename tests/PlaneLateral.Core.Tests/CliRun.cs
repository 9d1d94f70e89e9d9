using PlaneLateral.Cli;

namespace PlaneLateral.Tests;

/// <summary>Runs the command line as typed, capturing its exit code and both output streams.</summary>
internal static class CliRun
{
    public static (int Code, string Out, string Err) Run(params string[] args)
    {
        var o = new StringWriter();
        var e = new StringWriter();
        int code = CliApp.Run(args, o, e);
        return (code, o.ToString(), e.ToString());
    }
}
