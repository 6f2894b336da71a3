using System.Text.Json;
using StratLink.Checks;
using StratLink.Export;
using StratLink.Model;
using StratLink.ProjectIO;

namespace StratLink.Tests.Export;

/// <summary>
/// <c>run.json</c> names every file a build read with its SHA-256, checked against the worked example of
/// FIPS 180-2 (appendix B.1: SHA-256 of "abc").
/// </summary>
public sealed class RunManifestTests : IDisposable
{
    private const string AbcSha256 = "ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad";

    private readonly string _dir = Directory.CreateTempSubdirectory("stratlink-manifest-").FullName;

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    [Fact]
    public void A_dated_target_and_its_age_model_are_inputs_with_their_hashes()
    {
        string file = Path.Combine(_dir, "site.stratlink.yaml");
        File.WriteAllText(file, "format: stratlink-project/1\n");
        File.WriteAllText(Path.Combine(_dir, "core.csv"), "abc");
        File.WriteAllText(Path.Combine(_dir, "master.txt"), "abc");
        File.WriteAllText(Path.Combine(_dir, "master-ages.txt"), "abc");
        var project = new Project
        {
            Cores = [new CoreSpec { Id = "A", Table = "core.csv" }],
            Target = new DatedTargetSpec
            {
                Table = "master.txt",
                Signal = "d18O",
                DepthColumn = "mcd",
                AgeModel = new DatedTargetAgeModel { Table = "master-ages.txt" },
            },
        };
        var document = new ProjectDocument(file, project, new FindingList(), new SourceMap(file));
        string json = Path.Combine(_dir, "run.json");

        RunManifest.Write(json, document, project, new Dictionary<string, string>(), []);

        using var doc = JsonDocument.Parse(File.ReadAllText(json));
        var inputs = doc.RootElement.GetProperty("inputs").EnumerateObject().ToDictionary(p => p.Name, p => p.Value.GetString());
        Assert.Equal(["core.csv", "master.txt", "master-ages.txt"], inputs.Keys.ToArray());
        Assert.All(inputs.Values, hash => Assert.Equal(AbcSha256, hash));
    }
}
