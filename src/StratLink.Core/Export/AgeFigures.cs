using System.Globalization;
using StratLink.AgeModelling;
using StratLink.Export.Svg;
using StratLink.Quantities;

namespace StratLink.Export;

/// <summary>
/// <c>figures/ages-composite.svg</c>: the age model on the composite grid (median and 95 % band) above the
/// accumulation rate on event-free depth (median and 95 % band, log scale), both against composite depth, with
/// the composite scale's event layers shaded (they take no time, so the age is flat across them).
/// </summary>
public static class AgeFigures
{
    public const string FileName = "ages-composite.svg";

    public static SvgCanvas Composite(AgeModelResult ages)
    {
        var s = ages.Composite ?? throw new ArgumentException("The age model has no composite grid.", nameof(ages));
        string unit = s.Unit.Symbol();
        var age = new SvgPlot($"composite depth ({unit})", "age (cal BP)") { Title = "age model: median and 95 % range; shaded: event layers" }
            .Band(s.Depths, s.AgeLoBP, s.AgeHiBP, "95 % range")
            .Line(s.Depths, s.AgeMedianBP, "median", SvgStyle.Solid);
        var rate = new SvgPlot($"composite depth ({unit})", $"accumulation rate ({unit}/yr, event-free)") { LogY = true, Title = "accumulation rate: median and 95 % range" }
            .Band(s.Depths, Finite(s.RateLo), Finite(s.RateHi), "95 % range")
            .Line(s.Depths, Finite(s.RateMedian), "median", SvgStyle.Solid);
        var events = ages.CompositeEvents;
        for (int k = 0; k < events.Count; k++)
        {
            age.VerticalSpan(events.Tops[k], events.Bottoms[k], k == 0 ? "event layer" : null);
            rate.VerticalSpan(events.Tops[k], events.Bottoms[k], null);
        }
        return SvgPlot.Stack([age, rate], string.Create(CultureInfo.InvariantCulture, $"age model and accumulation rate (seed {ages.Seed})"));
    }

    /// <summary>Writes the figure into <paramref name="directory"/>; null when the model has no composite grid.</summary>
    public static string? Write(AgeModelResult ages, string directory)
    {
        if (ages.Composite is null || ages.Composite.Count == 0) return null;
        Directory.CreateDirectory(directory);
        string file = Path.Combine(directory, FileName);
        Composite(ages).Save(file);
        return file;
    }

    // A rate pooled to one age is infinite: leave it out of the drawing (NaN breaks the line).
    private static double[] Finite(double[] values) => values.Select(v => double.IsFinite(v) && v > 0 ? v : double.NaN).ToArray();
}
