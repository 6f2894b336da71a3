using System.Globalization;
using StratLink.Export.Svg;

namespace StratLink.Analysis;

/// <summary>The SVG figures of an <see cref="AnalysisResult"/>: spectrum, regime shifts, filtered record.</summary>
public static class AnalysisFigures
{
    /// <summary>The raw record, thin and grey behind what is fitted to it.</summary>
    private static readonly SvgStyle RecordStyle = new() { Stroke = SvgStyle.MidGrey, StrokeWidth = 0.7 };

    /// <summary>Ages in years for records up to 50 kyr long, in ka beyond, so tick labels stay short.</summary>
    private static (double Divisor, string Unit) AgeUnit(AnalysisResult r) => r.Series.AgesBP[0] > 50_000 ? (1000, "ka") : (1, "yr");

    private static double[] Scaled(double[] v, double divisor) => divisor == 1 ? v : v.Select(x => x / divisor).ToArray();

    private static string AgeLabel(AnalysisResult r) => $"Age ({AgeUnit(r).Unit} cal BP)";

    private static string PeriodText(AnalysisResult r, double years) =>
        AgeUnit(r).Divisor == 1 ? $"{Text(years)} yr" : $"{Text(years / 1000)} kyr";

    public static SvgCanvas Spectrum(AnalysisResult r)
    {
        var s = r.Spectrum;
        string unit = r.ValueUnit is null ? "value²·yr" : $"{r.ValueUnit}²·yr";
        var plot = new SvgPlot("Frequency (1/yr)", $"Power ({unit})")
        {
            Title = $"{r.SignalName}: spectrum against AR(1) red noise (tau {PeriodText(r, s.Persistence.TauYears)}; levels: {s.LevelSource})",
            LogX = true,
            LogY = true,
        };
        plot.Line(s.Frequencies, s.Power, "spectrum", SvgStyle.Solid with { StrokeWidth = 1.4 })
            .Line(s.Frequencies, s.Background, "AR(1) background", SvgStyle.Dashed)
            .Line(s.Frequencies, s.Level(95), "95 % level", SvgStyle.Dotted with { StrokeWidth = 1.2 })
            .Line(s.Frequencies, s.Level(99), "99 % level", SvgStyle.DashDot with { Stroke = SvgStyle.DarkGrey });
        foreach (var p in r.Periods) plot.VerticalMarker(1 / p.PeriodYears, PeriodText(r, p.PeriodYears), SvgStyle.Dotted);
        var panels = new List<SvgPlot> { plot };
        if (r.Ensemble is { } e)
        {
            var share = new SvgPlot("Frequency (1/yr)", "Share of members above 95 %")
            {
                Title = $"Across {e.Members.Length} age-model members (chi-square 95 % level of each)",
                LogX = true,
                YMin = 0,
                YMax = 1,
            };
            share.Line(s.Frequencies, e.ShareAbove95, null, SvgStyle.Solid with { StrokeWidth = 1.2 });
            foreach (var p in r.Periods) share.VerticalMarker(1 / p.PeriodYears, PeriodText(r, p.PeriodYears), SvgStyle.Dotted);
            panels.Add(share);
        }
        return SvgPlot.Stack(panels, $"{r.SignalName}: spectrum", 860, 360);
    }

    public static SvgCanvas Shifts(AnalysisResult r)
    {
        var series = r.Series;
        var (div, _) = AgeUnit(r);
        var plot = new SvgPlot(AgeLabel(r), ValueLabel(r))
        {
            Title = $"{r.SignalName}: regime shifts (Rodionov test, l = {r.Options.Regimes.CutoffLength} samples, p = {r.Options.Regimes.Probability.ToString("0.###", CultureInfo.InvariantCulture)})",
            ReverseX = true,
        };
        if (r.Ensemble is { } e)
        {
            var ranges = e.Shifts.Where(x => !double.IsNaN(x.AgeLoBP)).ToList();
            for (int i = 0; i < ranges.Count; i++)
                plot.VerticalSpan(ranges[i].AgeLoBP / div, ranges[i].AgeHiBP / div, i == 0 ? "95 % age range over members" : null);
        }
        var x = Scaled(series.AgesBP, div);
        plot.Line(x, series.Values, "record", RecordStyle)
            .Line(x, r.Regimes.RegimeMeans, "regime means", SvgStyle.Solid with { StrokeWidth = 2.2 });
        foreach (var shift in r.Regimes.Shifts) plot.VerticalMarker(shift.AgeBP / div, Text(shift.AgeBP / div), SvgStyle.Dashed);
        return SvgPlot.Stack([plot], $"{r.SignalName}: regime shifts", 860, 380);
    }

    public static SvgCanvas Filtered(AnalysisResult r)
    {
        var f = r.Filtered;
        var x = Scaled(f.AgesBP, AgeUnit(r).Divisor);
        var top = new SvgPlot(AgeLabel(r), ValueLabel(r))
        {
            Title = $"{r.SignalName}: Gaussian low-pass (sigma {PeriodText(r, f.LowPass.SigmaYears)}, half power at period {PeriodText(r, f.LowPass.HalfPowerShortPeriodYears)})",
            ReverseX = true,
        };
        top.Line(x, f.Values, "record", RecordStyle)
           .Line(x, f.LowPass.Values, "low-pass", SvgStyle.Solid with { StrokeWidth = 1.8 });
        var panels = new List<SvgPlot> { top };
        foreach (var b in f.BandPasses)
        {
            var p = new SvgPlot(AgeLabel(r), ValueLabel(r))
            {
                Title = $"Band-pass {PeriodText(r, b.CentrePeriodYears)} (half power {PeriodText(r, b.HalfPowerShortPeriodYears)} to {PeriodText(r, b.HalfPowerLongPeriodYears)})",
                ReverseX = true,
            };
            p.Line(x, b.Values, null, SvgStyle.Solid);
            panels.Add(p);
        }
        return SvgPlot.Stack(panels, $"{r.SignalName}: filtered record", 860, 300);
    }

    private static string ValueLabel(AnalysisResult r) => r.ValueUnit is null ? r.SignalName : $"{r.SignalName} ({r.ValueUnit})";

    private static string Text(double v) => double.IsPositiveInfinity(v) ? "∞" : v.ToString(Math.Abs(v) >= 100 ? "0" : "0.#", CultureInfo.InvariantCulture);
}
