using System.Globalization;
using StratLink.Demo;
using StratLink.ProjectIO;

namespace StratLink.Tests.Demo;

public sealed class DemoSiteWriterTests : IDisposable
{
    private readonly string _dir = Path.Combine(Path.GetTempPath(), "stratlink-demo-" + Guid.NewGuid().ToString("N"));

    public void Dispose()
    {
        if (Directory.Exists(_dir)) Directory.Delete(_dir, recursive: true);
    }

    [Fact]
    public void WritesTheProjectTablesVarvesAndTruth()
    {
        var site = DemoSiteGenerator.Generate(3);
        string path = DemoSiteWriter.Write(site, _dir);
        Assert.Equal(Path.Combine(_dir, "mirrowick-fjord.stratlink.yaml"), path);
        string[] expected =
        [
            "cores/MW19-F4-varves.csv", "cores/MW19-F4.csv", "cores/MW19-G3.csv", "cores/MW19-P1-varves.csv", "cores/MW19-P1.csv", "cores/MW19-P2.csv",
            "mirrowick-fjord.stratlink.yaml", "stratlink-project.schema.json",
            "truth/MW19-F4-truth.csv", "truth/MW19-G3-truth.csv", "truth/MW19-P1-truth.csv", "truth/MW19-P2-truth.csv", "truth/README.md",
        ];
        Assert.Equal(expected, Files(_dir));
    }

    [Fact]
    public void WrittenProjectReadsBackWithoutProblems()
    {
        var site = DemoSiteGenerator.Generate(1);
        var doc = ProjectReader.Load(DemoSiteWriter.Write(site, _dir));
        Assert.Empty(doc.Problems);
        var p = doc.Project!;
        Assert.Equal(site.Project.Cores, p.Cores, (a, b) => a.Id == b.Id && a.Table == b.Table && a.Gaps.SequenceEqual(b.Gaps) && a.Disturbed.SequenceEqual(b.Disturbed));
        Assert.Equal(site.Project.Markers.Select(m => m.Id), p.Markers.Select(m => m.Id));
        Assert.Equal(site.Project.Ages.Select(a => a.Id), p.Ages.Select(a => a.Id));
        Assert.Equal(ProjectWriter.ToYaml(site.Project), ProjectWriter.ToYaml(p));
        foreach (var core in p.Cores) Assert.True(File.Exists(doc.Resolve(core.Table)), core.Table);
    }

    [Fact]
    public void TablesAreInvariantCommaSeparatedAscendingAndMatchTheSiteInMemory()
    {
        var site = DemoSiteGenerator.Generate(1);
        DemoSiteWriter.Write(site, _dir);
        foreach (var (id, table) in site.Tables)
        {
            var rows = Read(Path.Combine(_dir, "cores", id + ".csv"), out string header);
            Assert.Equal("depth,ms,density,ca_ti", header);
            Assert.Equal(table.Count, rows.Count);
            for (int i = 0; i < rows.Count; i++)
            {
                if (i > 0) Assert.True(rows[i][0] > rows[i - 1][0]);
                Assert.Equal(table.Depths[i], rows[i][0], 9);
                // No outside source: the tolerance is the writer's own rounding, to 0.1 (ms) and 0.001
                // (density, ca_ti), i.e. half a unit of the last digit written.
                Assert.Equal(table.Signals["ms"][i], rows[i][1], 0.05 + 1e-9);
                Assert.Equal(table.Signals["density"][i], rows[i][2], 0.0005 + 1e-9);
                Assert.Equal(table.Signals["ca_ti"][i], rows[i][3], 0.0005 + 1e-9);
            }
            var truth = Read(Path.Combine(_dir, "truth", id + "-truth.csv"), out string truthHeader);
            Assert.Equal("depth_cm,true_composite_depth_cm,true_age_bp", truthHeader);
            Assert.Equal(table.Depths, truth.Select(r => r[0]));
            for (int i = 0; i < truth.Count; i++)
            {
                Assert.Equal(site.Truth[id].CompositeDepths[i], truth[i][1], 0.0005 + 1e-9);
                Assert.Equal(site.Truth[id].AgesBP[i], truth[i][2], 0.005 + 1e-9);
            }
        }
        var varves = Read(Path.Combine(_dir, "cores", "MW19-F4-varves.csv"), out string varveHeader);
        Assert.Equal("depth_top,depth_bottom", varveHeader);
        Assert.Equal(site.CountedVarves.Count, varves.Count);
        Assert.Equal(site.CountedVarves.Select(v => v.Bottom), varves.Select(r => r[1]));
        var referenceVarves = Read(Path.Combine(_dir, "cores", "MW19-P1-varves.csv"), out _);
        Assert.Equal(site.ReferenceCountedVarves.Select(v => v.Top), referenceVarves.Select(r => r[0]));
        string readme = File.ReadAllText(Path.Combine(_dir, "truth", "README.md"));
        Assert.Contains("invented", readme);
        Assert.Contains("seed 1", readme);
    }

    [Fact]
    public void WritingTheSameSeedTwiceGivesByteIdenticalFiles()
    {
        string a = Path.Combine(_dir, "a"), b = Path.Combine(_dir, "b");
        DemoSiteWriter.Write(DemoSiteGenerator.Generate(5), a);
        DemoSiteWriter.Write(DemoSiteGenerator.Generate(5), b);
        Assert.Equal(Files(a), Files(b));
        foreach (string f in Files(a)) Assert.Equal(File.ReadAllBytes(Path.Combine(a, f)), File.ReadAllBytes(Path.Combine(b, f)));
    }

    internal static List<string> Files(string dir) =>
        Directory.GetFiles(dir, "*", SearchOption.AllDirectories)
            .Select(f => Path.GetRelativePath(dir, f).Replace('\\', '/')).Order(StringComparer.Ordinal).ToList();

    private static List<double[]> Read(string path, out string header)
    {
        string[] lines = File.ReadAllText(path).Split('\n');
        Assert.Equal("", lines[^1]);
        header = lines[0];
        return lines[1..^1].Select(l => l.Split(',').Select(c => double.Parse(c, NumberStyles.Float, CultureInfo.InvariantCulture)).ToArray()).ToList();
    }
}
