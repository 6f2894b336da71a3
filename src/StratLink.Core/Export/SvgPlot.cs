using System.Globalization;
using System.Text;

namespace StratLink.Export;

/// <summary>
/// One panel of a plain SVG figure: axes with ticks and labelled titles (units in the label), lines, shaded
/// bands, vertical markers and spans, a legend. Greys and dash patterns keep it readable in black and white.
/// Render one panel with <see cref="ToSvg"/> or several stacked with <see cref="SvgFigure"/>.
/// </summary>
public sealed class SvgPlot
{
    private readonly List<Action<Frame, StringBuilder>> _layers = [];
    private readonly List<(string Label, string Swatch)> _legend = [];
    private double _xMin = double.PositiveInfinity, _xMax = double.NegativeInfinity;
    private double _yMin = double.PositiveInfinity, _yMax = double.NegativeInfinity;

    public SvgPlot(string xLabel, string yLabel)
    {
        XLabel = xLabel;
        YLabel = yLabel;
    }

    public string XLabel { get; }
    public string YLabel { get; }
    public string? Title { get; init; }
    public bool LogX { get; init; }
    public bool LogY { get; init; }

    /// <summary>Draw the x axis from high to low values (e.g. age, oldest on the left).</summary>
    public bool ReverseX { get; init; }

    public double? XMin { get; init; }
    public double? XMax { get; init; }
    public double? YMin { get; init; }
    public double? YMax { get; init; }

    public SvgPlot Line(IReadOnlyList<double> x, IReadOnlyList<double> y, string? label, SvgLineStyle style = SvgLineStyle.Solid,
        double width = 1.2, string colour = "#000")
    {
        Extend(x, y);
        string stroke = $"fill=\"none\" stroke=\"{colour}\" stroke-width=\"{F(width)}\"{Dash(style)}";
        _layers.Add((f, sb) =>
        {
            foreach (string d in Paths(f, x, y)) sb.Append($"<path d=\"{d}\" {stroke}/>\n");
        });
        if (label is not null) _legend.Add((label, $"<line x1=\"0\" y1=\"0\" x2=\"24\" y2=\"0\" {stroke}/>"));
        return this;
    }

    /// <summary>Shaded area between <paramref name="lo"/> and <paramref name="hi"/> (NaN breaks it).</summary>
    public SvgPlot Band(IReadOnlyList<double> x, IReadOnlyList<double> lo, IReadOnlyList<double> hi, string? label, string fill = "#c8c8c8")
    {
        Extend(x, lo);
        Extend(x, hi);
        _layers.Add((f, sb) =>
        {
            int i = 0;
            while (i < x.Count)
            {
                var run = new List<int>();
                for (; i < x.Count && f.Usable(x[i], lo[i]) && f.Usable(x[i], hi[i]); i++) run.Add(i);
                i++;
                if (run.Count < 2) continue;
                var d = new StringBuilder();
                foreach (int j in run) d.Append(d.Length == 0 ? 'M' : 'L').Append(F(f.X(x[j]))).Append(',').Append(F(f.Y(hi[j])));
                for (int j = run.Count - 1; j >= 0; j--) d.Append('L').Append(F(f.X(x[run[j]]))).Append(',').Append(F(f.Y(lo[run[j]])));
                sb.Append($"<path d=\"{d}Z\" fill=\"{fill}\" stroke=\"none\"/>\n");
            }
        });
        if (label is not null) _legend.Add((label, $"<rect x=\"0\" y=\"-5\" width=\"24\" height=\"10\" fill=\"{fill}\"/>"));
        return this;
    }

    /// <summary>A shaded vertical span from <paramref name="x1"/> to <paramref name="x2"/> over the full height.</summary>
    public SvgPlot VerticalSpan(double x1, double x2, string? label, string fill = "#dcdcdc")
    {
        Extend([x1, x2], []);
        _layers.Insert(0, (f, sb) =>
        {
            double a = f.X(x1), b = f.X(x2);
            sb.Append($"<rect x=\"{F(Math.Min(a, b))}\" y=\"{F(f.Top)}\" width=\"{F(Math.Max(Math.Abs(b - a), 1))}\" height=\"{F(f.Height)}\" fill=\"{fill}\"/>\n");
        });
        if (label is not null) _legend.Add((label, $"<rect x=\"0\" y=\"-5\" width=\"24\" height=\"10\" fill=\"{fill}\"/>"));
        return this;
    }

    /// <summary>A vertical line at <paramref name="x"/> with a short text written upwards beside its top end.</summary>
    public SvgPlot VerticalMarker(double x, string? text, SvgLineStyle style = SvgLineStyle.Dotted)
    {
        Extend([x], []);
        _layers.Add((f, sb) =>
        {
            double px = f.X(x);
            sb.Append($"<line x1=\"{F(px)}\" y1=\"{F(f.Top)}\" x2=\"{F(px)}\" y2=\"{F(f.Top + f.Height)}\" stroke=\"#000\" stroke-width=\"0.8\"{Dash(style)}/>\n");
            if (text is not null)
            {
                double tx = px - 3, ty = f.Top + 4;
                sb.Append($"<text x=\"{F(tx)}\" y=\"{F(ty)}\" font-size=\"10\" text-anchor=\"end\" transform=\"rotate(-90 {F(tx)} {F(ty)})\">{Escape(text)}</text>\n");
            }
        });
        return this;
    }

    public string ToSvg(int width = 800, int height = 420) => SvgFigure.Stack([this], width, height);

    /// <summary>Draws the panel into the box (left, top, width, height) of the figure.</summary>
    internal void Render(StringBuilder sb, double left, double top, double width, double height, string clipId)
    {
        const double marginLeft = 72, marginRight = 16, marginTop = 28, marginBottom = 46;
        var f = new Frame(left + marginLeft, top + marginTop, width - marginLeft - marginRight, height - marginTop - marginBottom,
            Range(XMin ?? _xMin, XMax ?? _xMax, LogX, padToTicks: false), Range(YMin ?? _yMin, YMax ?? _yMax, LogY, padToTicks: true), LogX, LogY, ReverseX);
        if (Title is not null)
            sb.Append($"<text x=\"{F(f.Left)}\" y=\"{F(top + 18)}\" font-size=\"14\" font-weight=\"bold\">{Escape(Title)}</text>\n");
        sb.Append($"<clipPath id=\"{clipId}\"><rect x=\"{F(f.Left)}\" y=\"{F(f.Top)}\" width=\"{F(f.Width)}\" height=\"{F(f.Height)}\"/></clipPath>\n");
        sb.Append($"<g clip-path=\"url(#{clipId})\">\n");
        foreach (var layer in _layers) layer(f, sb);
        sb.Append("</g>\n");
        Axes(sb, f);
        Legend(sb, f);
    }

    private void Axes(StringBuilder sb, Frame f)
    {
        sb.Append($"<rect x=\"{F(f.Left)}\" y=\"{F(f.Top)}\" width=\"{F(f.Width)}\" height=\"{F(f.Height)}\" fill=\"none\" stroke=\"#000\" stroke-width=\"1\"/>\n");
        double bottom = f.Top + f.Height;
        foreach (var (v, label) in Ticks(f.XRange, LogX))
        {
            double px = f.X(v);
            sb.Append($"<line x1=\"{F(px)}\" y1=\"{F(bottom)}\" x2=\"{F(px)}\" y2=\"{F(bottom + 5)}\" stroke=\"#000\"/>\n");
            sb.Append($"<text x=\"{F(px)}\" y=\"{F(bottom + 18)}\" font-size=\"11\" text-anchor=\"middle\">{label}</text>\n");
        }
        foreach (var (v, label) in Ticks(f.YRange, LogY))
        {
            double py = f.Y(v);
            sb.Append($"<line x1=\"{F(f.Left - 5)}\" y1=\"{F(py)}\" x2=\"{F(f.Left)}\" y2=\"{F(py)}\" stroke=\"#000\"/>\n");
            sb.Append($"<text x=\"{F(f.Left - 8)}\" y=\"{F(py + 4)}\" font-size=\"11\" text-anchor=\"end\">{label}</text>\n");
        }
        sb.Append($"<text x=\"{F(f.Left + f.Width / 2)}\" y=\"{F(bottom + 38)}\" font-size=\"12\" text-anchor=\"middle\">{Escape(XLabel)}</text>\n");
        double cy = f.Top + f.Height / 2, cx = f.Left - 56;
        sb.Append($"<text x=\"{F(cx)}\" y=\"{F(cy)}\" font-size=\"12\" text-anchor=\"middle\" transform=\"rotate(-90 {F(cx)} {F(cy)})\">{Escape(YLabel)}</text>\n");
    }

    private void Legend(StringBuilder sb, Frame f)
    {
        if (_legend.Count == 0) return;
        double w = 40 + 6.2 * _legend.Max(l => l.Label.Length), h = 8 + 16 * _legend.Count;
        double x = f.Left + f.Width - w - 6, y = f.Top + 6;
        sb.Append($"<rect x=\"{F(x)}\" y=\"{F(y)}\" width=\"{F(w)}\" height=\"{F(h)}\" fill=\"#fff\" fill-opacity=\"0.85\" stroke=\"#000\" stroke-width=\"0.5\"/>\n");
        for (int i = 0; i < _legend.Count; i++)
        {
            double ly = y + 12 + 16 * i;
            sb.Append($"<g transform=\"translate({F(x + 6)},{F(ly)})\">{_legend[i].Swatch}</g>\n");
            sb.Append($"<text x=\"{F(x + 36)}\" y=\"{F(ly + 4)}\" font-size=\"11\">{Escape(_legend[i].Label)}</text>\n");
        }
    }

    private void Extend(IReadOnlyList<double> x, IReadOnlyList<double> y)
    {
        foreach (double v in x)
            if (double.IsFinite(v) && (!LogX || v > 0)) { _xMin = Math.Min(_xMin, v); _xMax = Math.Max(_xMax, v); }
        foreach (double v in y)
            if (double.IsFinite(v) && (!LogY || v > 0)) { _yMin = Math.Min(_yMin, v); _yMax = Math.Max(_yMax, v); }
    }

    private static IEnumerable<string> Paths(Frame f, IReadOnlyList<double> x, IReadOnlyList<double> y)
    {
        var d = new StringBuilder();
        for (int i = 0; i < x.Count; i++)
        {
            if (!f.Usable(x[i], y[i]))
            {
                if (d.Length > 0) { yield return d.ToString(); d.Clear(); }
                continue;
            }
            d.Append(d.Length == 0 ? 'M' : 'L').Append(F(f.X(x[i]))).Append(',').Append(F(f.Y(y[i])));
        }
        if (d.Length > 0) yield return d.ToString();
    }

    /// <summary>Data range, padded to whole ticks (decades on a log axis) when asked; a degenerate range is widened.</summary>
    private static (double Lo, double Hi) Range(double lo, double hi, bool log, bool padToTicks)
    {
        if (!double.IsFinite(lo) || !double.IsFinite(hi)) return log ? (1, 10) : (0, 1);
        if (log && !padToTicks) return hi > lo ? (lo, hi) : (lo / 10, hi * 10);
        if (log)
        {
            double l = Math.Pow(10, Math.Floor(Math.Log10(lo))), h = Math.Pow(10, Math.Ceiling(Math.Log10(hi) - 1e-9));
            return (l, h > l ? h : l * 10);
        }
        if (hi - lo <= 0) { double pad = Math.Abs(lo) > 0 ? Math.Abs(lo) * 0.1 : 1; return (lo - pad, hi + pad); }
        if (!padToTicks) return (lo, hi);
        double step = NiceStep(hi - lo);
        return (Math.Floor(lo / step + 1e-9) * step, Math.Ceiling(hi / step - 1e-9) * step);
    }

    private static double NiceStep(double span)
    {
        double raw = span / 6, mag = Math.Pow(10, Math.Floor(Math.Log10(raw)));
        double n = raw / mag;
        return (n < 1.5 ? 1 : n < 3.5 ? 2 : n < 7.5 ? 5 : 10) * mag;
    }

    private static IEnumerable<(double Value, string Label)> Ticks((double Lo, double Hi) r, bool log)
    {
        if (log)
        {
            for (int e = (int)Math.Ceiling(Math.Log10(r.Lo) - 1e-9); e <= (int)Math.Floor(Math.Log10(r.Hi) + 1e-9); e++)
                yield return (Math.Pow(10, e), e is >= -3 and <= 4 ? Math.Pow(10, e).ToString("0.###", CultureInfo.InvariantCulture)
                    : $"10<tspan dy=\"-5\" font-size=\"8\">{e}</tspan>");
            yield break;
        }
        double step = NiceStep(r.Hi - r.Lo);
        int decimals = Math.Max(0, -(int)Math.Floor(Math.Log10(step) + 1e-9));
        for (double v = Math.Ceiling(r.Lo / step - 1e-6) * step; v <= r.Hi + step * 1e-6; v += step)
        {
            double snapped = Math.Round(v / step) * step + 0.0; // + 0.0 turns -0 into 0
            yield return (snapped, snapped.ToString("F" + decimals, CultureInfo.InvariantCulture));
        }
    }

    private static string Dash(SvgLineStyle style) => style switch
    {
        SvgLineStyle.Solid => "",
        SvgLineStyle.Dashed => " stroke-dasharray=\"6,4\"",
        SvgLineStyle.Dotted => " stroke-dasharray=\"1.5,3\"",
        SvgLineStyle.DashDot => " stroke-dasharray=\"8,3,2,3\"",
        _ => throw new ArgumentOutOfRangeException(nameof(style)),
    };

    internal static string F(double v) => v.ToString("0.##", CultureInfo.InvariantCulture);

    internal static string Escape(string s) => s.Replace("&", "&amp;").Replace("<", "&lt;").Replace(">", "&gt;");

    /// <summary>Maps data to pixels inside the plot area.</summary>
    private sealed record Frame(double Left, double Top, double Width, double Height, (double Lo, double Hi) XRange, (double Lo, double Hi) YRange,
        bool LogX, bool LogY, bool ReverseX)
    {
        public double X(double v)
        {
            double u = Scale(v, XRange, LogX);
            return Left + Width * (ReverseX ? 1 - u : u);
        }

        public double Y(double v) => Top + Height * (1 - Scale(v, YRange, LogY));

        public bool Usable(double x, double y) => double.IsFinite(x) && double.IsFinite(y) && (!LogX || x > 0) && (!LogY || y > 0);

        private static double Scale(double v, (double Lo, double Hi) r, bool log) =>
            log ? (Math.Log10(v) - Math.Log10(r.Lo)) / (Math.Log10(r.Hi) - Math.Log10(r.Lo)) : (v - r.Lo) / (r.Hi - r.Lo);
    }
}
