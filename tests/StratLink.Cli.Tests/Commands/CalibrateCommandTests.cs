using System.Globalization;
using System.Text.Json;
using System.Text.RegularExpressions;
using StratLink.Cli;
using StratLink.Tests.TestSupport;

namespace StratLink.Tests.Commands;

public partial class CalibrateCommandTests
{
    /// <summary>IntCal20 (Reimer et al. 2020) from ../shared/data beside the repository root; missing data fails loudly.</summary>
    private static string IntCal20() => RepoPaths.Data("calibration-curves", "intcal20.14c");

    private static (int Code, string Out, string Err) Run(params string[] args) => CliRunner.Run(args);

    [Fact]
    public void JsonAndCsvForScripts()
    {
        string csv = Path.Combine(Path.GetTempPath(), $"stratlink-cal-{Guid.NewGuid():N}.csv");
        try
        {
            var (code, output, err) = Run("calibrate", "--c14", "5000", "--error", "35", "--curve", IntCal20(), "--csv", csv, "--json");
            Assert.True(code == 0, err);
            using var doc = JsonDocument.Parse(output);
            double median = doc.RootElement.GetProperty("median_bp").GetDouble();
            // 5000 14C yr BP lies near 5700-5900 cal BP on IntCal20 (from memory; wide bound).
            Assert.InRange(median, 5600, 5900);
            var rows = File.ReadAllLines(csv);
            Assert.Equal("age_bp,probability", rows[0]);
            // The density is a probability distribution: it sums to 1.
            Assert.Equal(1.0, rows.Skip(1).Sum(r => double.Parse(r.Split(',')[1], CultureInfo.InvariantCulture)), 1e-9);
        }
        finally
        {
            File.Delete(csv);
        }
    }

    [Fact]
    public void TextReportWithReservoirOffset()
    {
        var (code, output, _) = Run("calibrate", "--c14", "2450", "--error", "30", "--curve", IntCal20(), "--delta-r", "100", "--delta-r-error", "40");
        Assert.Equal(ExitCodes.Success, code);
        Assert.Contains("Calibrated as     2350 +- 50 14C yr BP", output);
        Assert.Contains("95.4 % range", output);
        Assert.Contains("cal BP", output);
    }

    [Fact]
    public void DecimalCommaReadsAsADecimalMark()
    {
        // 3000,5 is 3000.5, not 30005 (the toolkit's default number parser allows thousands separators).
        var (code, output, err) = Run("calibrate", "--c14", "3000,5", "--error", "30,0", "--curve", IntCal20());
        Assert.True(code == 0, err);
        Assert.Contains("Radiocarbon age   3001 +- 30 14C yr BP", output);
        // 3000 14C yr BP calibrates to about 3200 cal BP on IntCal20 (from memory; wide bound).
        double median = double.Parse(MedianLine().Match(output).Groups[1].Value, CultureInfo.InvariantCulture);
        Assert.InRange(median, 3100, 3300);
    }

    [Fact]
    public void ModernDateExitsWithFindingAndMessage()
    {
        var (code, _, err) = Run("calibrate", "--c14", "-300", "--error", "30", "--curve", IntCal20());
        Assert.Equal(ExitCodes.Findings, code);
        Assert.Contains("modern", err);
    }

    [Fact]
    public void MissingCurveIsAUsageError()
    {
        var (code, _, err) = Run("calibrate", "--c14", "1000", "--error", "30", "--curve", "/no/such/curve.14c");
        Assert.Equal(ExitCodes.Usage, code);
        Assert.Contains("not found", err);
    }

    [GeneratedRegex(@"Median\s+(\d+) cal BP")]
    private static partial Regex MedianLine();
}
