using PlaneLateral.Elements.Plane;
using PlaneLateral.Meshing;
using static PlaneLateral.Tests.Panels.PlaneTestSupport;

namespace PlaneLateral.Tests.Panels;

/// <summary>
/// An element stiffness computed into a caller's buffer (the assembly of a stiffness-only analysis reuses one buffer
/// for every element) is the stiffness returned as a new matrix, whatever the buffer held before, and it is an element
/// stiffness: symmetric, and a rigid translation costs no force, each row summing to zero over the x and over the y
/// columns (rigid-body modes; Cook, Malkus, Plesha &amp; Witt, Concepts and Applications of FEA, 4th ed., 2002, §6.13).
/// </summary>
public class ElementStiffnessBufferTests
{
    // A distorted quadrilateral: the interior element of MacNeal & Harder's patch (1985, Fig. 1).
    private static readonly double[] X = [0.04, 0.18, 0.16, 0.08];
    private static readonly double[] Y = [0.02, 0.03, 0.08, 0.08];

    [Theory]
    [InlineData("QM6")]
    [InlineData("Q9")]
    public void The_buffer_receives_the_same_stiffness_as_a_new_matrix(string name)
    {
        var element = Element(name);
        var mesh = StructuredMesh.FromCorners(element, X, Y, [[0, 1, 2, 3]]);
        var (x, y) = mesh.ElementCoordinates(0);
        var material = new PlaneStressMaterial(1e6, 0.25, 0.001);
        var fresh = element.Stiffness(x, y, material);
        int n = fresh.GetLength(0);
        var buffer = new double[n, n];
        for (int i = 0; i < n; i++) for (int j = 0; j < n; j++) buffer[i, j] = double.NaN;   // what a previous element left, at worst
        element.Stiffness(x, y, material, buffer);
        element.Stiffness(x, y, material, buffer);   // twice: nothing accumulates across calls
        double max = 0;
        for (int i = 0; i < n; i++) for (int j = 0; j < n; j++) max = Math.Max(max, Math.Abs(fresh[i, j]));
        for (int i = 0; i < n; i++)
        {
            double sumX = 0, sumY = 0;
            for (int j = 0; j < n; j++)
            {
                Assert.Equal(fresh[i, j], buffer[i, j]);
                Assert.Equal(buffer[i, j], buffer[j, i]);
                if (j % 2 == 0) sumX += buffer[i, j]; else sumY += buffer[i, j];
            }
            Assert.True(Math.Abs(sumX) < 1e-12 * max && Math.Abs(sumY) < 1e-12 * max, $"row {i}: {sumX:E2}, {sumY:E2} against {max:E2}");
        }
    }
}
