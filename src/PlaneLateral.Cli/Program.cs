namespace PlaneLateral.Cli;

public static class Program
{
    public static int Main(string[] args)
    {
        SweepCommand.StartWarmUpEarly(args);   // a sweep's drawing library starts on the second processor while the command line is read
        return CliApp.Run(args, Console.Out, Console.Error);
    }
}
