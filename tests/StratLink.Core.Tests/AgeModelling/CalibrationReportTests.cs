using System.Globalization;
using System.Text.Json;
using StratLink.AgeModelling.Calibration;
using StratLink.Quantities;

namespace StratLink.Tests.AgeModelling;

public class CalibrationReportTests
{
    private static CalibrationReport Report(double age, double error, double deltaR = 0, double deltaRError = 0) =>
        new(RadiocarbonAge.FromYearsBP(age), error, deltaR, deltaRError,
            Calibrator.Calibrate(RadiocarbonAge.FromYearsBP(age), error, TestCurves.IntCal20, deltaR, deltaRError));

    [Fact]
    public void JsonCarriesMedianAndRangesWithProbabilities()
    {
        var report = Report(2450, 30);
        using var doc = JsonDocument.Parse(report.ToJson());
        var root = doc.RootElement;
        Assert.Equal("ok", root.GetProperty("status").GetString());
        Assert.Equal(Math.Round(report.Result.Density!.Median, 1), root.GetProperty("median_bp").GetDouble());
        var levels = root.GetProperty("hpd").EnumerateArray().ToList();
        Assert.Equal(2, levels.Count);
        // The HPD sets hold at least their level (standard HPD definition; methods section 1).
        foreach (var level in levels)
        {
            double sum = level.GetProperty("ranges").EnumerateArray().Sum(r => r.GetProperty("probability").GetDouble());
            Assert.InRange(sum, level.GetProperty("level").GetDouble() - 0.001, 1.0);
        }
    }

    [Fact]
    public void CsvDensitySumsToOneInAscendingYears()
    {
        var report = Report(5000, 35);
        var sw = new StringWriter();
        CalibrationReport.WriteDensityCsv(sw, report.Result.Density!);
        var rows = sw.ToString().Split('\n', StringSplitOptions.RemoveEmptyEntries);
        Assert.Equal("age_bp,probability", rows[0]);
        var parsed = rows.Skip(1).Select(r => r.Split(',')).Select(p => (Age: int.Parse(p[0], CultureInfo.InvariantCulture), P: double.Parse(p[1], CultureInfo.InvariantCulture))).ToList();
        Assert.Equal(1.0, parsed.Sum(p => p.P), 1e-12);
        Assert.True(parsed.Zip(parsed.Skip(1)).All(t => t.Second.Age == t.First.Age + 1));
    }

    [Fact]
    public void TextShowsRangesAndPlot()
    {
        var lines = Report(2450, 30, deltaR: 0).ToLines(plotWidth: 50, plotHeight: 4);
        Assert.Contains(lines, l => l.StartsWith("Median", StringComparison.Ordinal));
        Assert.Contains(lines, l => l.StartsWith("95.4 % range", StringComparison.Ordinal));
        var axis = lines.Single(l => l.Length == 50 && l.Contains('|') && l.Contains('='));
        Assert.Equal(1, axis.Count(c => c == '|'));
        Assert.Equal(4, lines.Count(l => l.Length == 50 && l.All(c => c == ' ' || (c >= '\u2581' && c <= '\u2588'))));
    }

    [Fact]
    public void ModernDateSaysSoWithoutNumbers()
    {
        var lines = Report(-200, 30).ToLines();
        Assert.Contains(lines, l => l.StartsWith("No calendar age:", StringComparison.Ordinal) && l.Contains("modern"));
        Assert.DoesNotContain(lines, l => l.StartsWith("Median", StringComparison.Ordinal));
        using var doc = JsonDocument.Parse(Report(-200, 30).ToJson());
        Assert.Equal("modern", doc.RootElement.GetProperty("status").GetString());
        Assert.False(doc.RootElement.TryGetProperty("median_bp", out _));
    }

    [Fact]
    public void BarsUseEighthBlocks()
    {
        // Eighth blocks U+2581..U+2588 (Unicode Block Elements): full column for the maximum, half for half.
        var lines = TextBars.Render([0.0, 1.0, 2.0], 1);
        Assert.Equal(" \u2584\u2588", Assert.Single(lines));
        var two = TextBars.Render([1.0, 4.0], 2);
        Assert.Equal([" \u2588", "\u2584\u2588"], two);
        Assert.Equal([1.0, 5.0], TextBars.SumIntoBins([1.0, 2.0, 3.0], -1, 2, 2));
    }
}
