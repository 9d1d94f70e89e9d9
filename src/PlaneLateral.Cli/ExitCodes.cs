namespace PlaneLateral.Cli;

/// <summary>Process exit codes (also listed in README and docs/cli.md).</summary>
public static class ExitCodes
{
    public const int Success = 0;
    /// <summary>The command line itself was wrong (unknown command or option).</summary>
    public const int Usage = 1;
    /// <summary>The model file is missing, not valid JSON, or describes an unusable model.</summary>
    public const int BadModel = 2;
    /// <summary>The model is a mechanism (unstable).</summary>
    public const int Unstable = 3;
    /// <summary>The results could not be written.</summary>
    public const int OutputFailed = 4;
    /// <summary>The program failed on an error of its own (reported without a stack trace).</summary>
    public const int InternalError = 5;
}
