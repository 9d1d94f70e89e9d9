using Newtonsoft.Json.Linq;
using PlaneLateral.Analysis;
using PlaneLateral.Model;
using PlaneLateral.Tests.Input;
using PlaneLateral.Units;
using static PlaneLateral.Tests.TestModels;

namespace PlaneLateral.Tests.Verification;

/// <summary>
/// Every model in models/verification/ is read from its file, solved, and compared with the expected values of its
/// "reference" block. Those values come from closed forms worked by hand (the arithmetic is in each value's note);
/// they are never taken from a run of the program. Results are converted from SI back to the model's units.
/// </summary>
public class VerificationModelTests
{
    private static readonly string[] Statuses = ["confirmed", "secondary", "from memory", "derived"];

    public static TheoryData<string> VerificationModels() =>
        new(RepositoryFiles.Models("verification").Select(m => m["verification/".Length..]));

    [Fact]
    public void AtLeastFiveVerificationModelsExist() =>
        Assert.True(RepositoryFiles.Models("verification").Count >= 5);

    [Theory]
    [MemberData(nameof(VerificationModels))]
    public void ModelReproducesItsReferenceValues(string file)
    {
        string path = RepositoryFiles.ModelPath("verification/" + file);
        var model = ModelReader.ReadFile(path);
        var result = LinearStaticAnalysis.Run(model);
        AssertChecks(result);

        var reference = JObject.Parse(File.ReadAllText(path))["reference"] as JObject;
        Assert.True(reference is not null, $"{file}: no \"reference\" block");
        Assert.False(string.IsNullOrWhiteSpace((string?)reference!["source"]), $"{file}: the reference names no source");
        Assert.Contains((string?)reference["status"], Statuses);
        var values = reference["values"] as JArray;
        Assert.True(values is { Count: > 0 }, $"{file}: the reference has no values");

        foreach (var v in values!.Cast<JObject>())
        {
            string quantity = (string)v["quantity"]!, node = (string)v["node"]!, direction = (string)v["direction"]!;
            string? caseId = (string?)v["case"];
            double expected = (double)v["expected"]!, tolerance = (double)v["relativeTolerance"]!;
            string what = $"{file}: {quantity} {caseId} {node} {direction}";
            Assert.False(string.IsNullOrWhiteSpace((string?)v["note"]), $"{what}: no note with the formula and arithmetic");
            Assert.True(expected != 0, $"{what}: a relative tolerance cannot check an expected zero");
            Assert.True(tolerance > 0 && tolerance <= 1e-6, $"{what}: relative tolerance {tolerance} outside (0, 1e-6]");
            Near(expected, Actual(result, model, quantity, caseId, node, direction, what), tolerance, what);
        }
    }

    private static double Actual(AnalysisResult r, StructureModel model, string quantity, string? caseId, string nodeId, string direction, string what)
    {
        var u = model.Units;
        int node = model.NodeIndex(nodeId);
        Assert.True(node >= 0, $"{what}: unknown node");
        var dof = direction switch
        {
            "x" => Dof.X,
            "y" => Dof.Y,
            "rz" => Dof.RZ,
            _ => throw new Xunit.Sdk.XunitException($"{what}: unknown direction"),
        };

        if (quantity == "stiffness")
        {
            Assert.True(caseId is null, $"{what}: a stiffness takes no case");
            var s = r.Stiffness.Where(p => p.Point.Node == node && p.Point.Direction == dof).ToList();
            Assert.True(s.Count == 1, $"{what}: {s.Count} stiffness points match");
            return u.FromSI(s[0].Stiffness, Quantity.TranslationalStiffness);
        }

        Assert.True(caseId is not null, $"{what}: no case");
        var c = r.Cases.SingleOrDefault(x => x.Id == caseId);
        Assert.True(c is not null, $"{what}: unknown load case or combination");
        switch (quantity)
        {
            case "displacement":
                double d = c!.Displacement(node, dof);
                return dof == Dof.RZ ? u.FromSI(d, Quantity.Rotation) : u.FromSI(d, Quantity.Length);
            case "reaction":
                var re = c!.Reactions.SingleOrDefault(x => x.Node == node);
                Assert.True(re is not null, $"{what}: no support at that node");
                return dof switch
                {
                    Dof.X => u.FromSI(re!.Fx, Quantity.Force),
                    Dof.Y => u.FromSI(re!.Fy, Quantity.Force),
                    _ => u.FromSI(re!.Mz, Quantity.Moment),
                };
            default:
                throw new Xunit.Sdk.XunitException($"{what}: unknown quantity (use displacement, reaction or stiffness)");
        }
    }
}
