using System.Globalization;
using System.IO.Compression;
using System.Security.Cryptography;
using System.Text;
using System.Text.Json;
using StratLink.Export;
using StratLink.Tests.Tables;
using StratLink.Tests.TestSupport;
using StratLink.Workflows;

namespace StratLink.Tests.Export;

/// <summary>
/// The LiPD export of the demo, read back with general-purpose readers only (System.IO.Compression's zip,
/// System.Text.Json, splitting CSV lines). Structure checked against the standard's documentation: LiPD
/// 1.3 (McKay and Emile-Geay 2016, Clim. Past 12:1093-1100, doi:10.5194/cp-12-1093-2016) - paleoData[] and
/// chronData[] hold measurementTable[] and model[] with summaryTable[] and ensembleTable[]; each table names
/// its headerless CSV (filename) and lists columns with number, variableName and units; an ensemble is one
/// column entry whose number is the list of its CSV columns. The zip holds a BagIt bag (RFC 8493: bagit.txt
/// declaring version and encoding, manifest-ALG.txt with one checksum per payload file, Payload-Oxum
/// "octets.count"). No LiPD schema is served by a package registry here (npm and NuGet hold none), so the
/// structure is checked by hand. The demo's age model runs 40 members instead of 2000 to keep the test short.
/// </summary>
public sealed class LipdWriterTests : IDisposable
{
    private const int Members = 40;
    private readonly TempFolder _dir = new();

    public void Dispose() => _dir.Dispose();

    [Fact]
    public void The_demo_round_trips_with_every_composite_column_its_unit_and_the_age_ensemble()
    {
        string project = CopyDemo();
        var loaded = ProjectLoader.Load(project);
        Assert.False(loaded.Problems.HasErrors, string.Join("\n", loaded.Problems));
        var build = BuildWorkflow.Run(loaded, null, CancellationToken.None);
        string lpd = Path.Combine(_dir.Path, "demo.lpd");
        using (var f = File.Create(lpd)) LipdWriter.Write(f, loaded.Project, build.Composite, build.Ages, "MarineSediment");
        var compositeCsv = new StringWriter();
        CompositeCsvWriter.Write(build.Composite, compositeCsv);
        string[] expectedHeader = compositeCsv.ToString().Split('\n')[0].Split(',');
        var expectedRows = compositeCsv.ToString().Split('\n', StringSplitOptions.RemoveEmptyEntries).Skip(1).Select(l => l.Split(',')).ToList();

        using var zip = ZipFile.OpenRead(lpd);
        var files = zip.Entries.ToDictionary(e => e.FullName, e => Read(e));
        Assert.Equal("BagIt-Version: 1.0\nTag-File-Character-Encoding: UTF-8\n", Encoding.UTF8.GetString(files["bag/bagit.txt"]));
        var payload = files.Where(f => f.Key.StartsWith("bag/data/", StringComparison.Ordinal)).ToList();
        var manifest = Encoding.UTF8.GetString(files["bag/manifest-sha256.txt"]).Split('\n', StringSplitOptions.RemoveEmptyEntries)
            .Select(l => l.Split("  ")).ToDictionary(p => "bag/" + p[1], p => p[0]);
        Assert.Equal(payload.Select(p => p.Key).Order(), manifest.Keys.Order());
        foreach (var (name, bytes) in payload) Assert.Equal(Convert.ToHexStringLower(SHA256.HashData(bytes)), manifest[name]);
        Assert.Contains($"Payload-Oxum: {payload.Sum(p => (long)p.Value.Length)}.{payload.Count}", Encoding.UTF8.GetString(files["bag/bag-info.txt"]));

        using var meta = JsonDocument.Parse(files["bag/data/metadata.jsonld"]);
        var root = meta.RootElement;
        Assert.Equal(1.3, root.GetProperty("lipdVersion").GetDouble());
        Assert.Equal("Mirrowick Fjord, inner basin", root.GetProperty("geo").GetProperty("properties").GetProperty("siteName").GetString());

        // The composite: every column of composite.csv, in order, each with its unit, values equal.
        var table = root.GetProperty("paleoData")[0].GetProperty("measurementTable")[0];
        var columns = table.GetProperty("columns").EnumerateArray().ToList();
        Assert.Equal(expectedHeader.Length, columns.Count);
        Assert.Equal(Enumerable.Range(1, columns.Count), columns.Select(c => c.GetProperty("number").GetInt32()));
        Assert.All(columns, c => Assert.False(string.IsNullOrEmpty(c.GetProperty("units").GetString())));
        Assert.Equal(columns.Count, columns.Select(c => c.GetProperty("TSid").GetString()).Distinct().Count());
        Assert.Equal("cm", columns[0].GetProperty("units").GetString());
        Assert.Equal("yr BP", columns[1].GetProperty("units").GetString());
        Assert.Equal(expectedHeader.Skip(5), columns.Skip(5).Select(c => c.GetProperty("variableName").GetString()));
        var rows = Csv(files["bag/data/" + table.GetProperty("filename").GetString()]);
        Assert.Equal(expectedRows.Count, rows.Count);
        for (int r = 0; r < rows.Count; r++)
        {
            Assert.Equal(columns.Count, rows[r].Length);
            for (int c = 0; c < columns.Count; c++)
                Assert.True(SameCell(expectedRows[r][c], rows[r][c]), $"row {r + 1}, column {expectedHeader[c]}: {expectedRows[r][c]} vs {rows[r][c]}");
        }

        // The age model: a summary table and the ensemble, one CSV column per member.
        var model = root.GetProperty("chronData")[0].GetProperty("model")[0];
        var summary = Csv(files["bag/data/" + model.GetProperty("summaryTable")[0].GetProperty("filename").GetString()]);
        var ensembleTable = model.GetProperty("ensembleTable")[0];
        var ensembleColumns = ensembleTable.GetProperty("columns").EnumerateArray().ToList();
        Assert.Equal("depth", ensembleColumns[0].GetProperty("variableName").GetString());
        Assert.Equal(Enumerable.Range(2, Members), ensembleColumns[1].GetProperty("number").EnumerateArray().Select(n => n.GetInt32()));
        Assert.Equal("yr BP", ensembleColumns[1].GetProperty("units").GetString());
        var ensemble = Csv(files["bag/data/" + ensembleTable.GetProperty("filename").GetString()]);
        Assert.Equal(summary.Count, ensemble.Count);
        for (int r = 0; r < ensemble.Count; r += 50)
        {
            Assert.Equal(1 + Members, ensemble[r].Length);
            var ages = ensemble[r].Skip(1).Select(s => double.Parse(s, CultureInfo.InvariantCulture)).Order().ToArray();
            // Median of an even count: mean of the middle two (Hyndman-Fan type 7); members are written to 0.1 yr.
            double median = (ages[Members / 2 - 1] + ages[Members / 2]) / 2;
            Assert.Equal(double.Parse(summary[r][1], CultureInfo.InvariantCulture), median, 0.1);
        }
    }

    private string CopyDemo()
    {
        foreach (string file in Directory.GetFiles(RepoPaths.DemoDirectory, "*", SearchOption.AllDirectories))
        {
            string target = Path.Combine(_dir.Path, "demo", Path.GetRelativePath(RepoPaths.DemoDirectory, file));
            Directory.CreateDirectory(Path.GetDirectoryName(target)!);
            File.Copy(file, target);
        }
        string project = Directory.GetFiles(Path.Combine(_dir.Path, "demo"), "*.stratlink.yaml").Single();
        string text = File.ReadAllText(project);
        Assert.Contains("iterations: 2000", text);
        File.WriteAllText(project, text.Replace("iterations: 2000", $"iterations: {Members}").Replace("ensemble: 200", "ensemble: 20"));
        return project;
    }

    private static byte[] Read(ZipArchiveEntry e)
    {
        using var s = e.Open();
        using var ms = new MemoryStream();
        s.CopyTo(ms);
        return ms.ToArray();
    }

    private static List<string[]> Csv(byte[] bytes) =>
        Encoding.UTF8.GetString(bytes).Split('\n', StringSplitOptions.RemoveEmptyEntries).Select(l => l.Split(',')).ToList();

    /// <summary>composite.csv leaves a missing value empty; the LiPD tables write the declared missingValue, NaN.</summary>
    private static bool SameCell(string csv, string lipd) =>
        csv.Length == 0 ? lipd == "NaN"
        : double.TryParse(csv, NumberStyles.Float, CultureInfo.InvariantCulture, out double a) ? double.Parse(lipd, CultureInfo.InvariantCulture) == a
        : csv == lipd;
}
