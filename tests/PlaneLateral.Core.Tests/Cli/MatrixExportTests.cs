using PlaneLateral.Analysis;
using PlaneLateral.Cli;
using PlaneLateral.Model;
using PlaneLateral.Solvers;
using static PlaneLateral.Tests.CliRun;

namespace PlaneLateral.Tests.Cli;

/// <summary>
/// "export-matrices": the files read back with the project's Matrix Market reader (NIST Matrix Market exchange format,
/// Boisvert, Pozo &amp; Remington, NISTIR 5935, 1996) reproduce the analysis: solved again by another solver, their
/// solutions match the analysis displacements, and the analysis displacements satisfy the read system to a normwise
/// backward error below 1e-12 (Higham, Accuracy and Stability of Numerical Algorithms, 2nd ed., 2002, Thm 7.1).
/// </summary>
[Collection("current directory")]
public sealed class MatrixExportTests : IDisposable
{
    private readonly string _dir = Directory.CreateTempSubdirectory("planelateral-export-").FullName;

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    private static string Shipped(params string[] parts) => Path.Combine([AppContext.BaseDirectory, "models", .. parts]);

    private static SymmetricSparseMatrix ReadK(string path)
    {
        using var r = new StreamReader(path);
        return MatrixMarket.ReadSymmetric(r);
    }

    private static double[][] ReadF(string path)
    {
        using var r = new StreamReader(path);
        return MatrixMarket.ReadColumns(r);
    }

    /// <summary>‖K u − f‖∞ / (‖K‖∞ ‖u‖∞ + ‖f‖∞).</summary>
    private static double BackwardError(SymmetricSparseMatrix k, double[] u, double[] f)
    {
        var ku = new double[u.Length];
        k.Multiply(u, ku);
        double r = 0;
        for (int i = 0; i < u.Length; i++) r = Math.Max(r, Math.Abs(ku[i] - f[i]));
        double d = k.InfinityNorm() * u.Max(Math.Abs) + f.Max(Math.Abs);
        return d == 0 ? 0 : r / d;
    }

    /// <summary>Solves the read system with the dense solver (not the analysis' sparse one) and compares.</summary>
    private static void AssertReproduces(SymmetricSparseMatrix k, double[][] f, IReadOnlyList<double[]> analysisU, string what)
    {
        Assert.Equal(analysisU.Count, f.Length);
        var factor = new DenseLdlSolver().Factorize(k);
        Assert.Empty(factor.PivotFailures);
        for (int c = 0; c < f.Length; c++)
        {
            var u = new double[k.Size];
            factor.Solve(f[c], u);
            double be = BackwardError(k, analysisU[c], f[c]);
            Assert.True(be < 1e-12, $"{what} case {c + 1}: backward error of the analysis displacements {be:E2}");
            Assert.True(BackwardError(k, u, f[c]) < 1e-12, $"{what} case {c + 1}: backward error of the re-solve");
            double scale = analysisU[c].Max(Math.Abs), diff = 0;
            for (int i = 0; i < u.Length; i++) diff = Math.Max(diff, Math.Abs(u[i] - analysisU[c][i]));
            // Two backward-stable solves of one system differ by at most about cond(K)·ε (Higham 2002, §7.1); these
            // models are far from that limit.
            Assert.True(scale == 0 || diff / scale < 1e-8, $"{what} case {c + 1}: re-solved displacements differ by {diff / scale:E2} of the largest");
        }
    }

    [Fact]
    public void FrameModelFilesReadBackSolveToTheAnalysisDisplacements()
    {
        string model = Shipped("demo-clinic.json");
        string outDir = Path.Combine(_dir, "m");
        var (code, stdout, stderr) = Run("export-matrices", model, "--out", outDir);
        Assert.True(code == 0, stderr);
        Assert.Contains("SI units", stdout);

        var result = LinearStaticAnalysis.Run(ModelReader.ReadFile(model));
        var k = ReadK(Path.Combine(outDir, "frame-K.mtx"));
        var f = ReadF(Path.Combine(outDir, "frame-f.mtx"));
        Assert.Equal(result.Dofs.FreeCount, k.Size);
        var cases = result.Cases.Where(c => !c.IsCombination).ToList();
        var u = cases.Select(c => Enumerable.Range(0, k.Size).Select(eq =>
        {
            var (n, d) = result.Dofs.DofOf(eq);
            return c.Displacements[3 * n + (int)d];
        }).ToArray()).ToList();
        AssertReproduces(k, f, u, "demo frame");

        // Index: every equation named once as its own, the diaphragm-tied DOFs listed as sharing it.
        var rows = File.ReadAllLines(Path.Combine(outDir, "frame-index.csv")).Skip(1).Select(l => l.Split(',')).ToList();
        var own = rows.Where(r => r[5] == "").Select(r => int.Parse(r[0])).ToList();
        Assert.Equal(Enumerable.Range(1, k.Size), own);
        Assert.Contains(rows, r => r[5].StartsWith("diaphragm tie: ux of node", StringComparison.Ordinal));
    }

    [Fact]
    public void PanelFilesReadBackSolveToTheAnalysisDisplacements()
    {
        string model = Shipped("panels", "two-story-wall.json");
        string outDir = Path.Combine(_dir, "p");
        var (code, _, stderr) = Run("export-matrices", model, "--out", outDir);
        Assert.True(code == 0, stderr);

        var result = LinearStaticAnalysis.Run(ModelReader.ReadFile(model));
        for (int p = 0; p < result.Panels.Count; p++)
        {
            var pr = result.Panels[p];
            string b = Path.Combine(outDir, PlaneLateral.Output.MatrixExportFiles.PanelBase(p, pr.Panel.Id));
            var k = ReadK(b + "-K.mtx");
            var f = ReadF(b + "-f.mtx");
            var dofs = pr.Analysis.Dofs;
            var u = pr.Analysis.Cases.Take(f.Length).Select(c => Enumerable.Range(0, k.Size).Select(eq =>
            {
                var (n, d) = dofs.DofOf(eq);
                return d == Dof.X ? c.Ux[n] : c.Uy[n];
            }).ToArray()).ToList();
            AssertReproduces(k, f, u, $"panel {pr.Panel.Id}");
            if (pr.Panel.FloorTies)
                Assert.Contains("floor tie: ux of node", File.ReadAllText(b + "-index.csv"));
        }
    }

    [Fact]
    public void HeadersNameTheFormatAndTheUnitsAndKIsTheLowerTriangle()
    {
        string outDir = Path.Combine(_dir, "h");
        Assert.Equal(0, Run("export-matrices", Shipped("demo-clinic.json"), "--out", outDir).Code);
        var kLines = File.ReadAllLines(Path.Combine(outDir, "frame-K.mtx"));
        Assert.Equal("%%MatrixMarket matrix coordinate real symmetric", kLines[0]);   // NISTIR 5935 (1996), header line
        Assert.Contains(kLines, l => l.StartsWith("% Units: SI", StringComparison.Ordinal));
        Assert.Contains(kLines, l => l.StartsWith('%') && l.Contains("licensed engineer"));
        var fLines = File.ReadAllLines(Path.Combine(outDir, "frame-f.mtx"));
        Assert.Equal("%%MatrixMarket matrix array real general", fLines[0]);
        Assert.Contains(fLines, l => l.StartsWith("% Units: SI", StringComparison.Ordinal));
        // Symmetric coordinate files store one triangle; ours the lower (row ≥ column), NISTIR 5935 §3.
        foreach (var l in kLines.SkipWhile(l => l.StartsWith('%')).Skip(1))
        {
            var t = l.Split(' ');
            Assert.True(int.Parse(t[0]) >= int.Parse(t[1]), l);
        }
    }

    [Fact]
    public void TwoExportsAreByteIdentical()
    {
        string a = Path.Combine(_dir, "a"), b = Path.Combine(_dir, "b");
        Assert.Equal(0, Run("export-matrices", Shipped("demo-clinic.json"), "--out", a).Code);
        Assert.Equal(0, Run("export-matrices", Shipped("demo-clinic.json"), "--out", b).Code);
        foreach (var f in Directory.GetFiles(a))
            Assert.Equal(File.ReadAllBytes(f), File.ReadAllBytes(Path.Combine(b, Path.GetFileName(f))));
    }

    [Fact]
    public void AnOutputFolderThatCannotBeWrittenIsAClearErrorAndNothingIsWritten()
    {
        string blocker = Path.Combine(_dir, "a-file");
        File.WriteAllText(blocker, "not a folder");
        string outDir = Path.Combine(blocker, "matrices");
        var (code, _, stderr) = Run("export-matrices", Shipped("demo-clinic.json"), "--out", outDir);
        Assert.Equal(ExitCodes.OutputFailed, code);
        Assert.Contains("cannot create the output folder", stderr);
        Assert.Contains("Fix:", stderr);
        Assert.Equal("not a folder", File.ReadAllText(blocker));
        Assert.Equal([blocker], Directory.GetFileSystemEntries(_dir));
    }

    [Fact]
    public void BadModelExitsNonZeroAndWritesNothing()
    {
        string model = Path.Combine(_dir, "bad.json");
        File.WriteAllText(model, "{ \"formatVersion\": 1, \"materials\": [] }");
        string outDir = Path.Combine(_dir, "out");
        var (code, _, stderr) = Run("export-matrices", model, "--out", outDir);
        Assert.Equal(ExitCodes.BadModel, code);
        Assert.Contains("bad.json:", stderr);
        Assert.Contains("Nothing was written", stderr);
        Assert.False(Directory.Exists(outDir));
    }
}
