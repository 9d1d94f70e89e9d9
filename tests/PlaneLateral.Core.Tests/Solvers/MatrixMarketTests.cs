using PlaneLateral.Solvers;
using static PlaneLateral.Tests.Solvers.TestMatrices;

namespace PlaneLateral.Tests.Solvers;

/// <summary>Matrix Market reading and writing (format: NIST Matrix Market exchange format, coordinate and array forms).</summary>
public class MatrixMarketTests
{
    [Fact]
    public void MatrixRoundTrip_IsExact()
    {
        var a = RandomLaplacianPlusDiagonal(80, 3, 2.5);
        var w = new StringWriter();
        a.WriteMatrixMarket(w, "test");
        var back = MatrixMarket.ReadSymmetric(new StringReader(w.ToString()));
        Assert.Equal(a.ColumnPointers, back.ColumnPointers);
        Assert.Equal(a.RowIndices, back.RowIndices);
        Assert.Equal(a.Values, back.Values);
    }

    [Fact]
    public void UpperTriangleEntries_AreStoredInTheLowerOne()
    {
        const string text = "%%MatrixMarket matrix coordinate real symmetric\n% c\n3 3 4\n1 1 2\n1 3 -1\n2 2 3\n3 3 4\n";
        var a = MatrixMarket.ReadSymmetric(new StringReader(text));
        Assert.Equal(new double[,] { { 2, 0, -1 }, { 0, 3, 0 }, { -1, 0, 4 } }, a.ToDense());
    }

    [Fact]
    public void ArrayRoundTrip_IsExact()
    {
        var v = RandomVector(17, 4);
        var w = new StringWriter();
        MatrixMarket.WriteArray(w, v, "rhs");
        Assert.StartsWith("%%MatrixMarket matrix array real general\n% rhs\n17 1\n", w.ToString());
        Assert.Equal(v, MatrixMarket.ReadArray(new StringReader(w.ToString())));
    }

    [Fact]
    public void GeneralMatrix_IsRejected() =>
        Assert.Throws<FormatException>(() => MatrixMarket.ReadSymmetric(new StringReader("%%MatrixMarket matrix coordinate real general\n1 1 1\n1 1 1\n")));
}
