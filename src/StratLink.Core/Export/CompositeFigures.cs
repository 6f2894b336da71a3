using System.Text.RegularExpressions;
using StratLink.Compositing;
using StratLink.Export.Svg;
using StratLink.Quantities;

namespace StratLink.Export;

/// <summary>
/// Figures of the stacked composite: for each signal the mean with its 95 % band and the spliced
/// record against composite depth and, when an age model exists, against age; below, the number of
/// cores contributing. Black and white: grey band, solid mean, dashed splice.
/// </summary>
public static partial class CompositeFigures
{
    private const double W = 900, H = 480, Left = 80, Right = 20, Top = 60;
    private const double MainHeight = 270, StripTop = Top + MainHeight + 50, StripHeight = 50;

    /// <summary>The signal's composite against composite depth (<paramref name="againstAge"/> false) or age; null when there are no ages.</summary>
    public static SvgCanvas? Profile(CompositeResult result, StackedRecord record, bool againstAge)
    {
        if (againstAge && result.Ages is null) return null;
        int rows = result.Grid.Count;
        var x = new double[rows];
        for (int r = 0; r < rows; r++) x[r] = againstAge ? result.Ages!.MedianBP[r] : result.Grid.ValueAt(r);
        string unit = result.Grid.Unit.Symbol();
        string xLabel = againstAge ? "age (cal BP, age-model median)" : $"composite depth ({unit})";
        string yLabel = record.Standardised ? $"{record.Signal} (z-score)" : record.Signal;
        string what = againstAge ? "age" : "composite depth";
        var canvas = new SvgCanvas(W, H, $"{record.Signal}: stacked composite against {what}");

        var (xMin, xMax) = Range(x);
        var (yMin, yMax) = Range(record.Lo.Concat(record.Hi).Concat(record.Mean).Concat(record.Spliced));
        double pad = (yMax - yMin) * 0.05;
        var plot = new PlotArea(canvas, Left, Top, W - Left - Right, MainHeight, (xMin, xMax), (yMin - pad, yMax + pad));
        plot.DrawAxes(xLabel, yLabel);
        canvas.Text(Left, 22, $"{record.Signal}: mean of up to {MaxOf(record.N)} cores with the 2.5-97.5 % band over cores and alignments; dashed: splice"
            + (record.Standardised ? " (per-core z-scores)" : ""), cssClass: "title");

        canvas.Path(BandOutline(plot, x, record.Lo, record.Hi), SvgStyle.Filled("#c8c8c8"), "band", $"band-{Safe(record.Signal)}", close: true);
        canvas.Path(Series(plot, x, record.Mean), new SvgStyle { StrokeWidth = 1.2 }, "mean", $"mean-{Safe(record.Signal)}");
        canvas.Path(Series(plot, x, record.Spliced), SvgStyle.Dashed with { StrokeWidth = 0.8 }, "splice", $"splice-{Safe(record.Signal)}");
        Legend(canvas, Left, 42);

        var strip = new PlotArea(canvas, Left, StripTop, W - Left - Right, StripHeight, (xMin, xMax), (0, Math.Max(1, MaxOf(record.N))));
        strip.DrawAxes(xLabel, "cores (n)", grid: false, yTickTarget: Math.Max(1, MaxOf(record.N)));
        var steps = new List<(double, double)>();
        for (int r = 0; r < rows; r++)
        {
            if (double.IsNaN(x[r])) { steps.Add((double.NaN, double.NaN)); continue; }
            steps.Add((strip.Px(x[r]), strip.Py(record.N[r])));
        }
        canvas.Path(steps, SvgStyle.Solid, "count", $"n-{Safe(record.Signal)}");
        return canvas;
    }

    /// <summary>Writes every profile into <paramref name="directory"/> and returns the files written.</summary>
    public static IReadOnlyList<string> WriteAll(CompositeResult result, string directory)
    {
        Directory.CreateDirectory(directory);
        var files = new List<string>();
        foreach (var record in result.Records)
            foreach (bool age in new[] { false, true })
                if (Profile(result, record, age) is { } canvas)
                {
                    string file = Path.Combine(directory, $"composite-{Safe(record.Signal)}-{(age ? "age" : "depth")}.svg");
                    canvas.Save(file);
                    files.Add(file);
                }
        return files;
    }

    /// <summary>A signal name made safe for file names and ids.</summary>
    public static string Safe(string name) => UnsafeChars().Replace(name, "_");

    [GeneratedRegex("[^A-Za-z0-9._-]")]
    private static partial Regex UnsafeChars();

    /// <summary>One row of keys above the plot, so it never hides data.</summary>
    private static void Legend(SvgCanvas canvas, double x, double y)
    {
        var g = canvas.Group("legend");
        canvas.Rect(x, y - 8, 24, 8, SvgStyle.Filled("#c8c8c8"), parent: g);
        canvas.Text(x + 30, y, "95 % band (cores and alignments)", parent: g);
        canvas.Line(x + 230, y - 4, x + 254, y - 4, new SvgStyle { StrokeWidth = 1.2 }, parent: g);
        canvas.Text(x + 260, y, "mean of cores", parent: g);
        canvas.Line(x + 370, y - 4, x + 394, y - 4, SvgStyle.Dashed with { StrokeWidth = 0.8 }, parent: g);
        canvas.Text(x + 400, y, "splice (one core at a time)", parent: g);
    }

    private static IEnumerable<(double, double)> Series(PlotArea plot, double[] x, IReadOnlyList<double> y)
    {
        for (int r = 0; r < x.Length; r++)
            yield return double.IsNaN(x[r]) || double.IsNaN(y[r]) ? (double.NaN, double.NaN) : (plot.Px(x[r]), plot.Py(y[r]));
    }

    /// <summary>Each run of rows with a band: along the top edge, then back along the bottom edge.</summary>
    private static IEnumerable<(double, double)> BandOutline(PlotArea plot, double[] x, IReadOnlyList<double> lo, IReadOnlyList<double> hi)
    {
        int r = 0;
        while (r < x.Length)
        {
            if (double.IsNaN(x[r]) || double.IsNaN(lo[r]) || double.IsNaN(hi[r])) { r++; continue; }
            int start = r;
            while (r < x.Length && !double.IsNaN(x[r]) && !double.IsNaN(lo[r]) && !double.IsNaN(hi[r])) r++;
            for (int k = start; k < r; k++) yield return (plot.Px(x[k]), plot.Py(hi[k]));
            for (int k = r - 1; k >= start; k--) yield return (plot.Px(x[k]), plot.Py(lo[k]));
            yield return (double.NaN, double.NaN);
        }
    }

    private static (double Min, double Max) Range(IEnumerable<double> values)
    {
        double min = double.PositiveInfinity, max = double.NegativeInfinity;
        foreach (double v in values)
        {
            if (!double.IsFinite(v)) continue;
            if (v < min) min = v;
            if (v > max) max = v;
        }
        return min <= max ? (min, max) : (0, 1);
    }

    private static int MaxOf(IReadOnlyList<int> n) => n.Count == 0 ? 0 : n.Max();
}
