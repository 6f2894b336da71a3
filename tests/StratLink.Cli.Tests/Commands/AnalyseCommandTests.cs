using System.Globalization;
using System.Text.RegularExpressions;
using StratLink.Tests.TestSupport;
using Xunit.Abstractions;

namespace StratLink.Tests.Commands;

/// <summary>
/// <c>stratlink analyse</c> on the demo, whose hidden truth (generator: cycles of 11 and 88 yr, regime shifts at
/// 1480 and 2710 cal BP) is the outside reference; Lomb 1976, Scargle 1982, Schulz and Mudelsee 2002 for the
/// spectrum and Rodionov 2004 (GRL 31:L09204) for the shifts.
/// </summary>
public sealed partial class AnalyseCommandTests(ITestOutputHelper log) : IDisposable
{
    private readonly string _dir = Directory.CreateTempSubdirectory("stratlink-analyse-").FullName;

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    /// <summary>Analyses the demo's Ca/Ti with the options given; the printed report and the output folder.</summary>
    private (string Output, string Target) AnalyseDemo(params string[] options)
    {
        string project = CliRunner.CopyDemo(Path.Combine(_dir, "demo"));
        string target = Path.Combine(_dir, "out");
        var (code, output, err) = CliRunner.Run(["analyse", project, "--signal", "ca_ti", .. options, "--out", target]);
        Assert.True(code == 0, output + err);
        log.WriteLine(output);
        return (output, target);
    }

    [Fact]
    public void The_demo_cycles_and_shifts_are_found_with_the_long_record_defaults()
    {
        var (output, target) = AnalyseDemo("--periods", "11,88", "--members", "100");

        Assert.Contains("100 age-model members", output);
        // Default cut-off 150 yr on a record sampled about every 2 yr: l = 70-80 samples.
        var l = Regex.Match(output, @"l = (\d+) samples = 150 yr, p = 0\.05, h = 2\)");
        Assert.True(l.Success, output);
        Assert.InRange(int.Parse(l.Groups[1].Value, CultureInfo.InvariantCulture), 70, 80);
        foreach (string period in new[] { "11", "88" })
        {
            var m = Regex.Match(output, $@"  {period} yr: .* above it in (\d+) % of members");
            Assert.True(m.Success, output);
            Assert.True(int.Parse(m.Groups[1].Value, CultureInfo.InvariantCulture) > 50, $"{period} yr: {m.Value}");
        }
        // Each true shift lies within half the regime test's cut-off (75 yr) of the member age range of a shift the
        // test reports: with the varve-dated demo those ranges (about 20 yr) are narrower than the precision of a
        // shift's place in a noisy record, which the cut-off sets (Rodionov 2004).
        const double reach = 75;
        // The generator's Ca/Ti falls at 1480 cal BP and rises at 2710 cal BP (read forward in time, towards the present).
        static double N(Group g) => double.Parse(g.Value, CultureInfo.InvariantCulture);
        var shifts = ShiftRange().Matches(output).Select(m => (Rises: N(m.Groups[2]) > N(m.Groups[1]), Lo: N(m.Groups[3]), Hi: N(m.Groups[4]))).ToList();
        foreach (var (trueAge, rises) in new[] { (1480.0, false), (2710.0, true) })
            Assert.Contains(shifts, r => r.Rises == rises && r.Lo - reach <= trueAge && trueAge <= r.Hi + reach);
        Assert.True(File.Exists(Path.Combine(target, "shifts.csv")));
    }

    [Fact]
    public void A_cutoff_under_two_samples_is_reported_with_the_length_used()
    {
        // The demo is sampled about every 2 yr: a 1 yr cut-off is half a sample, and Rodionov's test (2004) needs l >= 2.
        var (output, target) = AnalyseDemo("--shift-cutoff", "1", "--members", "10");
        var l = Regex.Match(output, @"l = 2 samples = (\d+) yr, the least the test takes; --shift-cutoff 1 yr is shorter, p = 0\.05");
        Assert.True(l.Success, output);
        double spacing = double.Parse(File.ReadAllLines(Path.Combine(target, "summary.csv")).Single(r => r.StartsWith("mean_spacing_yr,", StringComparison.Ordinal)).Split(',')[1], CultureInfo.InvariantCulture);
        Assert.Equal(Math.Round(2 * spacing), double.Parse(l.Groups[1].Value, CultureInfo.InvariantCulture));
    }

    [Theory]
    [InlineData("--shift-cutoff", "0")]
    [InlineData("--shift-probability", "1.5")]
    [InlineData("--huber", "-1")]
    [InlineData("--huber", "2,000")]
    [InlineData("--members", "0")]
    public void Bad_regime_settings_are_usage_errors_naming_the_option(string option, string value)
    {
        string project = CliRunner.CopyDemo(Path.Combine(_dir, "demo"));
        var (code, output, err) = CliRunner.Run("analyse", project, "--signal", "ca_ti", option, value, "--out", Path.Combine(_dir, "out"));
        Assert.Equal(2, code);
        Assert.Contains(option, err);
        Assert.Equal("", output);
    }

    [GeneratedRegex(@"mean (-?[\d.]+) -> (-?[\d.]+)(?: \(tentative\))?, 95 % range over members (-?\d+)-(-?\d+) cal BP")]
    private static partial Regex ShiftRange();
}
