using PlaneLateral.Solvers;
using static PlaneLateral.Tests.Solvers.MoreTestMatrices;
using static PlaneLateral.Tests.Solvers.TestMatrices;

namespace PlaneLateral.Tests.Solvers;

/// <summary>Runs alone: it switches the dense kernels' vector width for the whole process while it runs.</summary>
[CollectionDefinition("kernel width", DisableParallelization = true)]
public sealed class KernelWidthCollection;

/// <summary>
/// Same bits at every vector width (docs/hardening.md, "Same bytes on any machine"): the supernodal factor and the
/// envelope solver's results, computed in this process with the dense kernels on 256-bit vectors, on 128-bit vectors and
/// on scalar code (<see cref="DenseKernels.VectorBits"/>), are bitwise equal — every stored entry of L, the solutions, the
/// failed pivots and the mechanism shapes. Common practice: a fixed operation order per entry and no fused multiply-add
/// make IEEE 754 double arithmetic reproducible (IEEE 754-2019, §11, "Reproducible floating-point results").
/// </summary>
[Collection("kernel width")]
public sealed class KernelWidthTests
{
    private static readonly int[] Widths = { 256, 128, 0 };

    private static T AtWidth<T>(int bits, Func<T> run)
    {
        int saved = DenseKernels.VectorBits;
        DenseKernels.VectorBits = bits;
        try { return run(); }
        finally { DenseKernels.VectorBits = saved; }
    }

    public static TheoryData<string> Cases() => new() { "dense", "grid", "random", "floating", "threads" };

    private static SymmetricSparseMatrix Build(string kind) => kind switch
    {
        // One 300-row front: full interior tiles, diagonal tiles and edge tiles, several panels (300 > 48 columns).
        "dense" => DenseSpd(300, 21),
        // Many small fronts (a 2-DOF plane grid, AMD order): the small-front path.
        "grid" => TwoDofQuadGrid(30, 28, 4),
        // Irregular fronts of every size from a random sparse pattern.
        "random" => RandomLaplacianPlusDiagonal(900, 6, edgesPerNode: 4.0),
        // A floating grid (no shift: singular by one rigid-body mode): one failed pivot and its mechanism shape.
        "floating" => GridStencil(24, 23, 1, scrambleSeed: 3, shift: 0.0),
        // A front above the threaded-update threshold (384 rows), factorised on two threads.
        _ => DenseSpd(450, 22),
    };

    [Theory]
    [MemberData(nameof(Cases))]
    public void SupernodalFactor_SameBitsAtEveryVectorWidth(string kind)
    {
        var a = Build(kind);
        var b = RandomVector(a.Size, 7);
        int threads = kind == "threads" ? 2 : 1;
        var runs = Widths.Select(bits => AtWidth(bits, () =>
        {
            var f = (SupernodalFactor)new SupernodalCholeskySolver(SupernodalOrdering.ApproximateMinimumDegree, threads).Factorize(a);
            var x = new double[a.Size];
            f.Solve(b, x);
            var shapes = Enumerable.Range(0, f.PivotFailures.Count).Select(f.MechanismShape).ToArray();
            return (L: f.Values.ToArray(), X: x, Failures: f.PivotFailures.ToArray(), Shapes: shapes);
        })).ToArray();
        Assert.Equal(kind == "floating", runs[0].Failures.Length > 0);
        Assert.True(ResidualNorm(a, runs[0].X, b) < 1e-8 * Norm(b) || kind == "floating");
        for (int i = 1; i < runs.Length; i++)
        {
            Assert.True(BitwiseEqual(runs[0].L, runs[i].L), $"{kind}: L differs between {Widths[0]} and {Widths[i]} bits");
            Assert.True(BitwiseEqual(runs[0].X, runs[i].X), $"{kind}: solution differs between {Widths[0]} and {Widths[i]} bits");
            Assert.Equal(runs[0].Failures, runs[i].Failures);
            for (int s = 0; s < runs[0].Shapes.Length; s++) Assert.True(BitwiseEqual(runs[0].Shapes[s], runs[i].Shapes[s]));
        }
    }

    [Theory]
    [InlineData(3)]
    [InlineData(37)]
    [InlineData(1000)]
    public void DotAndSubtractScaled_SameBitsAtEveryVectorWidth(int n)
    {
        var x = RandomVector(n, 11);
        var y = RandomVector(n, 12);
        var dots = Widths.Select(bits => AtWidth(bits, () => DenseKernels.Dot(x, y))).ToArray();
        var updates = Widths.Select(bits => AtWidth(bits, () =>
        {
            var z = (double[])y.Clone();
            DenseKernels.SubtractScaled(z, 0.318309886, x);
            return z;
        })).ToArray();
        for (int i = 1; i < Widths.Length; i++)
        {
            Assert.Equal(BitConverter.DoubleToInt64Bits(dots[0]), BitConverter.DoubleToInt64Bits(dots[i]));
            Assert.True(BitwiseEqual(updates[0], updates[i]));
        }
    }

    [Fact]
    public void EnvelopeSolver_SameBitsAtEveryVectorWidth()
    {
        var a = QuadCellGrid(40, 37, 5);
        var b = RandomVector(a.Size, 8);
        var xs = Widths.Select(bits => AtWidth(bits, () =>
        {
            var x = new double[a.Size];
            new EnvelopeCholeskySolver().Factorize(a).Solve(b, x);
            return x;
        })).ToArray();
        for (int i = 1; i < xs.Length; i++) Assert.True(BitwiseEqual(xs[0], xs[i]), $"differs at {Widths[i]} bits");
    }

    private static bool BitwiseEqual(double[] a, double[] b) =>
        a.Length == b.Length && a.Select(BitConverter.DoubleToInt64Bits).SequenceEqual(b.Select(BitConverter.DoubleToInt64Bits));
}
