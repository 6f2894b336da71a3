using StratLink.Compositing;
using StratLink.Export.Svg;
using StratLink.Model;
using StratLink.Quantities;
using StratLink.Workflows;

namespace StratLink.Export;

/// <summary>
/// The cores side by side on their own depth scales, depth downwards as in core logs: one track per
/// signal, gaps hatched, disturbed intervals grey, marker ties drawn across between neighbouring
/// cores (line pattern by marker kind), and the splice intervals as black bars beside each core.
/// Each signal trace is one &lt;path class="signal-trace" id="trace-CORE-SIGNAL"&gt;.
/// </summary>
public static class CorrelationPanel
{
    private const double TrackWidth = 70, TrackGap = 8, CoreGap = 70, Left = 90, Top = 70, PlotHeight = 640, BottomSpace = 70;
    private const double SpliceBarOffset = 10, SpliceBarWidth = 5;

    public const string TraceClass = "signal-trace";

    public static SvgCanvas Draw(LoadedProject project, CompositeResult result)
    {
        var unit = project.Project.DepthUnit;
        string u = unit.Symbol();
        var composited = result.Mappings.Select(m => m.CoreId).ToHashSet(StringComparer.Ordinal);
        var cores = project.Project.Cores.Where(c => composited.Contains(c.Id) && project.Tables.ContainsKey(c.Id)).ToList();
        var signals = result.Records.Select(r => r.Signal).ToList();
        var tracks = cores.Select(c => signals.Where(project.Tables[c.Id].Signals.ContainsKey).ToList()).ToList();

        // Column geometry: each core's left edge and width.
        var colLeft = new double[cores.Count];
        var colWidth = new double[cores.Count];
        double x = Left + SpliceBarOffset + SpliceBarWidth;
        for (int i = 0; i < cores.Count; i++)
        {
            colLeft[i] = x;
            colWidth[i] = Math.Max(1, tracks[i].Count) * (TrackWidth + TrackGap) - TrackGap;
            x += colWidth[i] + CoreGap;
        }
        // At least as wide as the legend.
        double width = Math.Max(x - CoreGap + 40, 880);
        var canvas = new SvgCanvas(width, Top + PlotHeight + BottomSpace, "Cores side by side with marker ties and splice intervals");

        double dMin = cores.Min(c => project.Tables[c.Id].Depths[0]);
        double dMax = cores.Max(c => project.Tables[c.Id].Depths[^1]);
        var area = new PlotArea(canvas, Left, Top, width - Left - 40, PlotHeight, (0, 1), (dMin, dMax), yDownward: true);
        area.DrawLeftAxis($"core depth ({u}), each core on its own scale");
        string hatch = canvas.HatchPattern("gap-hatch");

        for (int i = 0; i < cores.Count; i++)
        {
            var spec = cores[i];
            var table = project.Tables[spec.Id];
            var g = canvas.Group("core", $"core-{spec.Id}");
            string header = spec.Id == result.ReferenceCore ? $"{spec.Id} (reference)" : spec.Id;
            canvas.Text(colLeft[i] + colWidth[i] / 2, Top - 40, header, "middle", cssClass: "core-name", parent: g, fontSize: 13);
            foreach (var gap in spec.Gaps)
                canvas.Rect(colLeft[i], area.Py(gap.Top.In(unit)), colWidth[i], area.Py(gap.Bottom.In(unit)) - area.Py(gap.Top.In(unit)),
                    GapStyle(hatch), "gap", parent: g);
            foreach (var dist in spec.Disturbed)
                canvas.Rect(colLeft[i], area.Py(dist.Top.In(unit)), colWidth[i], area.Py(dist.Bottom.In(unit)) - area.Py(dist.Top.In(unit)),
                    DisturbedStyle, "disturbed", parent: g);
            for (int t = 0; t < tracks[i].Count; t++)
            {
                string signal = tracks[i][t];
                double left = colLeft[i] + t * (TrackWidth + TrackGap);
                canvas.Rect(left, area.Py(table.Depths[0]), TrackWidth, area.Py(table.Depths[^1]) - area.Py(table.Depths[0]), SvgStyle.Thin, "track", parent: g);
                canvas.Text(left + TrackWidth / 2, Top - 22, signal, "middle", cssClass: "signal-name", parent: g, fontSize: 10);
                canvas.Path(Trace(table.Depths, table.Signals[signal], spec, area, left), new SvgStyle { StrokeWidth = 0.7 },
                    TraceClass, $"trace-{spec.Id}-{CompositeFigures.Safe(signal)}", g);
            }
            foreach (var piece in result.Splice.Pieces.Where(p => p.Core == spec.Id))
            {
                double top = area.Py(piece.CoreFrom.In(unit)), bottom = area.Py(piece.CoreTo.In(unit));
                canvas.Rect(colLeft[i] - SpliceBarOffset - SpliceBarWidth / 2, top, SpliceBarWidth, bottom - top, SpliceStyle, "splice", parent: g);
            }
        }

        DrawTies(canvas, project.Project, cores, colLeft, colWidth, area, unit);
        Legend(canvas, Left, Top + PlotHeight + 30, hatch);
        return canvas;
    }

    /// <summary>Writes the panel to <c>correlation.svg</c> in <paramref name="directory"/>.</summary>
    public static string Write(LoadedProject project, CompositeResult result, string directory)
    {
        Directory.CreateDirectory(directory);
        string file = Path.Combine(directory, "correlation.svg");
        Draw(project, result).Save(file);
        return file;
    }

    private static void DrawTies(SvgCanvas canvas, Project project, List<CoreSpec> cores, double[] colLeft, double[] colWidth, PlotArea area, DepthUnit unit)
    {
        var g = canvas.Group("ties");
        foreach (var marker in project.Markers)
        {
            var style = TieStyle(marker.Kind);
            var holders = Enumerable.Range(0, cores.Count).Where(i => marker.DepthIn(cores[i].Id) is not null).ToList();
            foreach (int i in holders)
            {
                double y = area.Py(marker.DepthIn(cores[i].Id)!.Value.In(unit));
                canvas.Line(colLeft[i], y, colLeft[i] + colWidth[i], y, style, "tie-mark", parent: g);
            }
            for (int k = 1; k < holders.Count; k++)
            {
                int a = holders[k - 1], b = holders[k];
                double ya = area.Py(marker.DepthIn(cores[a].Id)!.Value.In(unit));
                double yb = area.Py(marker.DepthIn(cores[b].Id)!.Value.In(unit));
                canvas.Line(colLeft[a] + colWidth[a], ya, colLeft[b], yb, style, "tie", $"tie-{marker.Id}-{k}", g);
            }
            if (holders.Count > 0)
            {
                int last = holders[^1];
                double y = area.Py(marker.DepthIn(cores[last].Id)!.Value.In(unit));
                canvas.Text(colLeft[last] + colWidth[last] + 3, y - 2, marker.Id, cssClass: "tie-label", parent: g, fontSize: 9);
            }
        }
    }

    /// <summary>Tephras solid and heavier, turbidites dashed, floods dotted, other events dash-dotted.</summary>
    private static SvgStyle TieStyle(MarkerKind kind) => kind switch
    {
        MarkerKind.Tephra => SvgStyle.Solid with { StrokeWidth = 1.4 },
        MarkerKind.Turbidite => SvgStyle.Dashed,
        MarkerKind.Flood => SvgStyle.Dotted,
        _ => SvgStyle.DashDot,
    };

    private static SvgStyle GapStyle(string hatch) => new() { Fill = hatch, StrokeWidth = 0.5 };

    private static readonly SvgStyle DisturbedStyle = new() { Fill = SvgStyle.PaleGrey, StrokeWidth = 0.5, Dash = "2 2" };
    private static readonly SvgStyle SpliceStyle = SvgStyle.Filled("black");

    /// <summary>The signal across its track, scaled to its 1-99 % range; breaks at missing values, gaps and disturbed intervals.</summary>
    private static IEnumerable<(double, double)> Trace(double[] depths, double[] values, CoreSpec spec, PlotArea area, double left)
    {
        var usable = new List<double>();
        for (int i = 0; i < depths.Length; i++)
            if (!double.IsNaN(values[i]) && !spec.IsUnusable(depths[i])) usable.Add(values[i]);
        usable.Sort();
        double lo = Statistics.PercentileSorted(usable.ToArray(), 1), hi = Statistics.PercentileSorted(usable.ToArray(), 99);
        if (!(hi > lo)) { lo -= 0.5; hi += 0.5; }
        for (int i = 0; i < depths.Length; i++)
        {
            if (double.IsNaN(values[i]) || spec.IsUnusable(depths[i])) { yield return (double.NaN, double.NaN); continue; }
            double f = Math.Clamp((values[i] - lo) / (hi - lo), 0, 1);
            yield return (left + 2 + f * (TrackWidth - 4), area.Py(depths[i]));
        }
    }

    private static void Legend(SvgCanvas canvas, double x, double y, string hatch)
    {
        var g = canvas.Group("legend");
        x = canvas.Key(x, y, GapStyle(hatch), "gap (no recovery)", g, swatchWidth: 18);
        x = canvas.Key(x, y, DisturbedStyle, "disturbed", g, swatchWidth: 18);
        x = canvas.Key(x, y, SpliceStyle, "splice interval", g, swatchWidth: SpliceBarWidth);
        foreach (var (kind, name) in new[] { (MarkerKind.Tephra, "tephra"), (MarkerKind.Turbidite, "turbidite"), (MarkerKind.Flood, "flood"), (MarkerKind.Event, "other marker") })
            x = canvas.Key(x, y, TieStyle(kind), name, g);
    }
}
