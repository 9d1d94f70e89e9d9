using System.Text;
using PlaneLateral.Model;

namespace PlaneLateral.Tests.Input;

/// <summary>
/// The provenance a report prints: each input file's size and SHA-256 of the bytes read. The digests are the FIPS 180-2
/// (NIST, 2002, appendix B.1) test vector for "abc" and that of the empty message, so a wrong digest cannot pass.
/// </summary>
public sealed class InputFileTests : IDisposable
{
    private readonly string _dir = Directory.CreateTempSubdirectory("planelateral-input-").FullName;

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    [Theory]
    [InlineData("abc", "ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad")]   // FIPS 180-2, B.1
    [InlineData("", "e3b0c44298fc1c149afbf4c8996fb92427ae41e4649b934ca495991b7852b855")]      // SHA-256 of no bytes, from memory
    public void TheDigestIsThatOfTheBytesRead(string content, string sha256)
    {
        string path = Path.Combine(_dir, "x.json");
        File.WriteAllBytes(path, Encoding.ASCII.GetBytes(content));
        ModelFile.ReadText(path, out var input);
        Assert.Equal(sha256, input.Sha256);
        Assert.Equal(content.Length, input.Bytes);
        Assert.Equal(path, input.Path);
    }

    [Fact]
    public void AModelAndABuildingCarryTheirFiles()
    {
        string planar = RepositoryFiles.ModelPath("demo-clinic.json");
        var m = ModelReader.ReadFile(planar);
        var one = Assert.Single(m.Inputs);
        Assert.Equal(new FileInfo(planar).Length, one.Bytes);
        Assert.Empty(ModelReader.Parse(File.ReadAllText(planar)).Inputs);   // parsed from text: no file to name

        string building = RepositoryFiles.ModelPath("demo-building.json");
        var b = ModelReader.ReadPlanFile(building);
        Assert.Equal(building, b.Inputs[0].Path);
        Assert.Equal(new FileInfo(building).Length, b.Inputs[0].Bytes);
        Assert.Equal(b.Inputs.Count, b.Inputs.Select(x => x.Path).Distinct().Count());   // each file once
    }
}
