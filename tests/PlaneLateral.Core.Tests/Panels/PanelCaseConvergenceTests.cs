using Newtonsoft.Json.Linq;
using PlaneLateral.Analysis;
using PlaneLateral.Model;
using PlaneLateral.Output;

namespace PlaneLateral.Tests.Panels;

/// <summary>
/// A panel's load-case results carry the error estimate of that very number: with a mesh study they are extrapolated
/// over the meshes like the stiffness (Richardson, Phil. Trans. R. Soc. A 210, 1911; Roache, Verification and Validation
/// in Computational Science and Engineering, 1998, ch. 5), not read off the coarsest mesh.
/// </summary>
public class PanelCaseConvergenceTests
{
    private static string RepoRoot()
    {
        var d = new DirectoryInfo(AppContext.BaseDirectory);
        while (d is not null && !File.Exists(Path.Combine(d.FullName, "PlaneLateral.sln"))) d = d.Parent;
        return d?.FullName ?? throw new InvalidOperationException("repository root not found");
    }

    [Fact]
    public void Load_case_top_displacement_agrees_with_the_force_over_the_extrapolated_stiffness_within_its_error()
    {
        // Derived: the wind case is one force P = 120 kN through the top tie, so in a linear panel its top displacement is
        // exactly P × (the unit-force flexibility) on every mesh; the extrapolated displacement must therefore equal
        // P/k∞ to within the displacement's own printed error estimate.
        var model = ModelReader.ReadFile(Path.Combine(RepoRoot(), "models/panels/squat-wall.json"));
        var r = LinearStaticAnalysis.Run(model);
        var p = Assert.Single(r.Panels);
        var cv = p.Convergence!;
        Assert.True(double.IsFinite(cv.Extrapolated), cv.Note);
        double force = model.Units.ToSI(120, Units.Quantity.Force);
        double expected = force / cv.Extrapolated;
        double top = p.TopDisplacement(0), err = p.LevelDisplacementErrors![0][^1];
        Assert.True(double.IsFinite(err) && err > 0, $"error estimate {err}");
        Assert.True(Math.Abs(top - expected) <= err * Math.Abs(top), $"top {top} m against P/k∞ {expected} m, estimated error {err:P4}");
        // The base mesh alone is off by more than that estimate (the number the table used to print).
        Assert.True(Math.Abs(force / p.TopStiffness - expected) > err * Math.Abs(expected), "the base mesh is within the estimate: the test shows nothing");

        // panels.json prints the extrapolated stiffness and displacement, each with its own error estimate.
        var json = JObject.Parse(PanelResultFiles.Render(r).Single(f => f.Name == "panels.json").Text);
        var jp = (JObject)((JArray)json["panels"]!)[0];
        double k = model.Units.FromSI(cv.Extrapolated, Units.Quantity.TranslationalStiffness);
        Assert.Equal(k, (double)jp["topStiffness"]!, 9);
        Assert.Equal(cv.EstimatedError, (double)jp["topStiffnessEstimatedError"]!, 12);
        var jc = (JObject)((JArray)jp["cases"]!)[0];
        Assert.Equal(err, (double)jc["topDisplacementEstimatedError"]!, 12);
    }
}
