using System.Text.Json;
using StratLink.Tests.TestSupport;

namespace StratLink.Tests.Commands;

/// <summary>The build on the demo: every output file of the project-file specification with its columns.</summary>
public sealed class BuildCommandTests : IDisposable
{
    private readonly string _dir = Directory.CreateTempSubdirectory("stratlink-build-").FullName;

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    [Fact]
    public void Build_writes_every_output_with_the_specified_columns_and_is_reproducible()
    {
        string project = CliRunner.CopyDemo(Path.Combine(_dir, "demo"));
        string out1 = Path.Combine(_dir, "out1"), out2 = Path.Combine(_dir, "out2");
        var (code, output, err) = CliRunner.Run("build", project, "--out", out1);
        Assert.True(code == 0, output + err);
        // The demo has turbidites and flood beds: their recurrence is not a hazard assessment.
        Assert.Contains("qualified specialists", output);

        string[] cores = ["MW19-P1", "MW19-P2", "MW19-G3", "MW19-F4"];
        foreach (string core in cores)
        {
            AssertHeader(Path.Combine(out1, $"mapping-{core}.csv"), "depth_cm", "composite_depth_cm", "composite_depth_lo_cm", "composite_depth_hi_cm");
            AssertHeader(Path.Combine(out1, $"ages-{core}.csv"), "depth_cm", "age_median_bp", "age_lo_bp", "age_hi_bp",
                "event_free_depth_cm", "rate_median_cm_per_yr", "rate_lo_cm_per_yr", "rate_hi_cm_per_yr", "time_median_yr_per_cm", "time_lo_yr_per_cm", "time_hi_yr_per_cm");
        }
        Assert.Contains("accumulation rate", File.ReadAllText(Path.Combine(out1, "figures", "ages-composite.svg")));
        AssertHeader(Path.Combine(out1, "ages-composite.csv"), "composite_depth_cm", "age_median_bp", "event_free_depth_cm", "rate_median_cm_per_yr", "time_hi_yr_per_cm");
        AssertHeader(Path.Combine(out1, "composite.csv"), "composite_depth_cm", "age_median_bp", "age_lo_bp", "age_hi_bp", "source_core",
            "ms_mean", "ms_lo", "ms_hi", "ms_n", "density_mean", "ca_ti_mean");
        AssertHeader(Path.Combine(out1, "checks.csv"), "severity", "code", "core", "item", "depth_cm", "message");
        AssertAscending(Path.Combine(out1, "composite.csv"));
        AssertAscending(Path.Combine(out1, "mapping-MW19-G3.csv"));

        using var run = JsonDocument.Parse(File.ReadAllText(Path.Combine(out1, "run.json")));
        Assert.Equal(42, run.RootElement.GetProperty("seed").GetInt32());
        Assert.Equal(64, run.RootElement.GetProperty("project_sha256").GetString()!.Length);
        Assert.False(string.IsNullOrEmpty(run.RootElement.GetProperty("version").GetString()));
        var stages = run.RootElement.GetProperty("stages_seconds");
        foreach (string stage in new[] { "load", "prepare", "align", "ensemble", "ages", "composite", "checks", "write" })
            Assert.True(stages.GetProperty(stage).GetDouble() >= 0, $"stage {stage} has no time in run.json");

        // Seeded throughout: a second build of the same inputs is identical, file for file, apart from
        // the stage timings that end run.json.
        var (code2, output2, _) = CliRunner.Run("build", project, "--out", out2, "--verbose");
        Assert.Equal(0, code2);
        Assert.Contains("ensemble", output2);
        foreach (string file in Directory.GetFiles(out1, "*", SearchOption.AllDirectories))
            Assert.True(WithoutTimings(file).AsSpan().SequenceEqual(WithoutTimings(Path.Combine(out2, Path.GetRelativePath(out1, file)))),
                $"{Path.GetRelativePath(out1, file)} differs between two builds of the same project");
    }

    private static byte[] WithoutTimings(string file)
    {
        byte[] bytes = File.ReadAllBytes(file);
        if (Path.GetFileName(file) != "run.json") return bytes;
        int at = bytes.AsSpan().IndexOf("\"stages_seconds\""u8);
        return at < 0 ? bytes : bytes[..at];
    }

    [Fact]
    public void A_project_with_errors_builds_nothing()
    {
        string project = CliRunner.CopyDemo(Path.Combine(_dir, "demo"));
        File.Delete(Path.Combine(_dir, "demo", "cores", "MW19-P2.csv"));
        string target = Path.Combine(_dir, "out");
        var (code, _, err) = CliRunner.Run("build", project, "--out", target);
        Assert.Equal(2, code);
        Assert.Contains("MW19-P2.csv", err);
        Assert.False(Directory.Exists(target));
    }

    private static void AssertHeader(string file, params string[] columns)
    {
        Assert.True(File.Exists(file), $"{Path.GetFileName(file)} was not written");
        string header = File.ReadLines(file).First();
        var names = header.Split(',');
        foreach (string c in columns) Assert.Contains(c, names);
    }

    private static void AssertAscending(string file)
    {
        double last = double.NegativeInfinity;
        foreach (string line in File.ReadLines(file).Skip(1))
        {
            double d = double.Parse(line.Split(',')[0], System.Globalization.CultureInfo.InvariantCulture);
            Assert.True(d > last, $"{Path.GetFileName(file)}: depth {d} after {last}");
            last = d;
        }
    }
}
