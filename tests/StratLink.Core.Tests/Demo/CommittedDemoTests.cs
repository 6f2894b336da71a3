using StratLink.Demo;

namespace StratLink.Tests.Demo;

/// <summary>
/// The repository commits the demo site generated with seed 1 in projects-demo/. These tests keep it
/// in step with the generator; with STRATLINK_WRITE_DEMO=1 the first one rewrites it instead.
/// </summary>
public sealed class CommittedDemoTests : IDisposable
{
    private const int CommittedSeed = 1;
    private readonly string _temp = Path.Combine(Path.GetTempPath(), "stratlink-demo-" + Guid.NewGuid().ToString("N"));

    public void Dispose()
    {
        if (Directory.Exists(_temp)) Directory.Delete(_temp, recursive: true);
    }

    private static string DemoDir() => Path.Combine(RepositoryRoot(), "projects-demo");

    [Fact]
    public void CommittedDemoIsTheSeedOneSiteByteForByte()
    {
        var site = DemoSiteGenerator.Generate(CommittedSeed);
        if (Environment.GetEnvironmentVariable("STRATLINK_WRITE_DEMO") == "1")
        {
            if (Directory.Exists(DemoDir())) Directory.Delete(DemoDir(), recursive: true);
            DemoSiteWriter.Write(site, DemoDir());
        }
        DemoSiteWriter.Write(site, _temp);
        const string hint = "projects-demo is stale: regenerate it with STRATLINK_WRITE_DEMO=1 dotnet test --filter CommittedDemo";
        Assert.True(Directory.Exists(DemoDir()), hint);
        Assert.Equal(DemoSiteWriterTests.Files(_temp), DemoSiteWriterTests.Files(DemoDir()));
        foreach (string f in DemoSiteWriterTests.Files(_temp))
            Assert.True(File.ReadAllBytes(Path.Combine(_temp, f)).AsSpan().SequenceEqual(File.ReadAllBytes(Path.Combine(DemoDir(), f))), $"{f}: {hint}");
    }

    [Fact]
    public void CommittedDemoStaysSmall()
    {
        long bytes = Directory.GetFiles(DemoDir(), "*", SearchOption.AllDirectories).Sum(f => new FileInfo(f).Length);
        Assert.True(bytes < 3_000_000, $"projects-demo holds {bytes} bytes");
    }

    /// <summary>Walks up from the test assembly to the folder holding StratLink.sln.</summary>
    private static string RepositoryRoot()
    {
        for (var dir = new DirectoryInfo(AppContext.BaseDirectory); dir is not null; dir = dir.Parent)
            if (File.Exists(Path.Combine(dir.FullName, "StratLink.sln"))) return dir.FullName;
        throw new InvalidOperationException($"No StratLink.sln above {AppContext.BaseDirectory}");
    }
}
