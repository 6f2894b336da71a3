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

    private static readonly SvgStyle BandStyle = SvgStyle.Filled(SvgStyle.BandGrey);
    private static readonly SvgStyle MeanStyle = SvgStyle.Solid with { StrokeWidth = 1.2 };
    private static readonly SvgStyle SpliceStyle = SvgStyle.Dashed with { StrokeWidth = 0.8 };

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

        var (xMin, xMax) = Extent(x);
        var (yMin, yMax) = Extent(record.Lo.Concat(record.Hi).Concat(record.Mean).Concat(record.Spliced));
        double pad = (yMax - yMin) * 0.05;
        var plot = new PlotArea(canvas, Left, Top, W - Left - Right, MainHeight, (xMin, xMax), (yMin - pad, yMax + pad));
        plot.DrawAxes(xLabel, yLabel);
        canvas.Text(Left, 22, $"{record.Signal}: mean of up to {MaxOf(record.N)} cores with the 2.5-97.5 % band over cores and alignments; dashed: splice"
            + (record.Standardised ? " (per-core z-scores)" : ""), cssClass: "title");

        canvas.Path(plot.BandOutline(x, record.Lo, record.Hi), BandStyle, "band", $"band-{Safe(record.Signal)}", close: true);
        canvas.Path(plot.Series(x, record.Mean), MeanStyle, "mean", $"mean-{Safe(record.Signal)}");
        canvas.Path(plot.Series(x, record.Spliced), SpliceStyle, "splice", $"splice-{Safe(record.Signal)}");
        var legend = canvas.Group("legend");
        double key = canvas.Key(Left, 42, BandStyle, "95 % band (cores and alignments)", legend);
        key = canvas.Key(key, 42, MeanStyle, "mean of cores", legend);
        canvas.Key(key, 42, SpliceStyle, "splice (one core at a time)", legend);

        var strip = new PlotArea(canvas, Left, StripTop, W - Left - Right, StripHeight, (xMin, xMax), (0, Math.Max(1, MaxOf(record.N))));
        strip.DrawAxes(xLabel, "cores (n)", grid: false, yTickTarget: Math.Max(1, MaxOf(record.N)));
        canvas.Path(strip.Series(x, record.N.Select(n => (double)n).ToArray()), SvgStyle.Solid, "count", $"n-{Safe(record.Signal)}");
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

    /// <summary>The finite values' range; (0, 1) when there are none.</summary>
    private static (double Min, double Max) Extent(IEnumerable<double> values)
    {
        var (min, max) = PlotArea.Extent(values);
        return min <= max ? (min, max) : (0, 1);
    }

    private static int MaxOf(IReadOnlyList<int> n) => n.Count == 0 ? 0 : n.Max();
}
