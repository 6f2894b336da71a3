using StratLink.Tests.TestSupport;

namespace StratLink.Tests.Commands;

public sealed class DemoCommandTests : IDisposable
{
    private readonly string _dir = Directory.CreateTempSubdirectory("stratlink-demo-").FullName;

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    [Fact]
    public void Seed_1_writes_the_committed_demo_project()
    {
        var (code, output, _) = CliRunner.Run("demo", _dir);
        Assert.Equal(0, code);
        Assert.Contains("mirrowick-fjord.stratlink.yaml", output);
        foreach (string file in Directory.GetFiles(RepoPaths.DemoDirectory, "*", SearchOption.AllDirectories))
        {
            string written = Path.Combine(_dir, Path.GetRelativePath(RepoPaths.DemoDirectory, file));
            Assert.True(File.ReadAllBytes(file).AsSpan().SequenceEqual(File.ReadAllBytes(written)), $"{written} differs from projects-demo");
        }
    }

    [Fact]
    public void Another_seed_writes_another_site()
    {
        Assert.Equal(0, CliRunner.Run("demo", _dir, "--seed", "7").Code);
        string mine = File.ReadAllText(Path.Combine(_dir, "cores", "MW19-P1.csv"));
        Assert.NotEqual(File.ReadAllText(Path.Combine(RepoPaths.DemoDirectory, "cores", "MW19-P1.csv")), mine);
    }
}
