namespace PlaneLateral.Reports.Tests;

/// <summary>Tests that run the CLI share one collection so they never run side by side with a change of current directory.</summary>
[CollectionDefinition("current directory", DisableParallelization = true)]
public class CurrentDirectoryCollection;
