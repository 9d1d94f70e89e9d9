using PlaneLateral.Model;
using PlaneLateral.Studies;
using PlaneLateral.Tests.Input;

namespace PlaneLateral.Tests.Plan;

/// <summary>
/// The hand tributary split of floors that bend is worked out once, into the building's run (<see cref="PlanRun.Tributary"/>);
/// the console, the files and the report read it (Architecture/RenderersReadOnlyTests forbids them to work it out).
/// </summary>
public class PlanRunOnceTests
{
    [Fact]
    public async Task TheRunHoldsTheTributarySplitOfFloorsThatBend()
    {
        var run = await Task.Run(() => PlanRun.Run(ModelReader.ReadPlanFile(RepositoryFiles.ModelPath("plan/long-warehouse.json")))).WaitAsync(TimeSpan.FromSeconds(120));
        Assert.NotNull(run.Result.Diaphragms);
        Assert.NotEmpty(run.Tributary);
        // The same rows a separate computation gives (the split is statics on the run's result: nothing is solved).
        Assert.Equal(PlanTributarySplit.Run(run.Result), run.Tributary);
    }

    [Fact]
    public async Task ABuildingOfRigidFloorsHasNoTributarySplit()
    {
        var run = await Task.Run(() => PlanRun.Run(ModelReader.ReadPlanFile(RepositoryFiles.ModelPath("plan/taly-example-7-12.json")))).WaitAsync(TimeSpan.FromSeconds(120));
        Assert.Null(run.Result.Diaphragms);
        Assert.Empty(run.Tributary);
    }
}
