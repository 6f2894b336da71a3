using StratLink.Quantities;

namespace StratLink.Alignment;

/// <summary>
/// Continues a mapping over the part of a core that runs past the reference, where nothing is
/// compared: at the rate ratio of the aligned part next to it (fitted over twice the extrapolated
/// distance where the aligned part is that long, at least 10 grid steps: rate ratios wiggle, and a
/// longer stretch averages them; held within a factor 2 of the ties' mean ratio). In ensemble members the log rate ratio departs from the
/// fitted one as a stationary first-order autoregressive (Ornstein-Uhlenbeck) process plus the
/// fitted mean's own error, so the band widens with distance from the last matched sample but the
/// ratio stays within what the aligned part shows: its spread s and correlation length (one window)
/// are measured on the optimal mapping's log rate ratio over adjacent windows of the aligned part,
/// the mean's error is s x sqrt(window / fitted stretch).
/// </summary>
internal sealed class EndExtension
{
    private const int MinFitSteps = 10;
    private const int MaxWalkKnots = 50;
    private const double MaxRatioDeparture = 2;

    /// <summary>Largest spread of log rate ratio used (a factor of about 1.65 at 1 sigma): a path's own jitter must not pass for rate changes.</summary>
    private const double MaxSpread = 0.5;

    private readonly double _top, _bottom, _gridStep, _spread, _window, _tieRatio;
    private readonly bool _extendTop, _extendBottom;

    private EndExtension(double top, double bottom, double gridStep, double spread, double window, double tieRatio, bool extendTop, bool extendBottom)
    {
        (_top, _bottom, _gridStep, _spread, _window, _tieRatio, _extendTop, _extendBottom) = (top, bottom, gridStep, spread, window, tieRatio, extendTop, extendBottom);
    }

    public static EndExtension Measure(DepthMapping optimal, double coreTop, double coreBottom, double gridStep, CoreOverhang overhang)
    {
        var x = optimal.CoreKnots;
        double x0 = x[0], x1 = x[^1], length = x1 - x0;
        double window = Math.Max(20 * gridStep, length / 20);
        var logRatios = new List<double>();
        for (double a = x0; a + window <= x1; a += window)
            logRatios.Add(Math.Log(Math.Max(1e-3, (optimal.ToCompositeValue(a + window) - optimal.ToCompositeValue(a)) / window)));
        double spread = 0;
        if (logRatios.Count > 1)
        {
            double mean = logRatios.Average();
            spread = Math.Sqrt(logRatios.Sum(v => (v - mean) * (v - mean)) / (logRatios.Count - 1));
        }
        return new EndExtension(coreTop, coreBottom, gridStep, Math.Min(spread, MaxSpread), window, overhang.MeanTieRatio, overhang.Top > 0, overhang.Bottom > 0);
    }

    /// <summary>The mapping continued to the core's ends; with <paramref name="rng"/> the rate ratio varies, without it it stays at the fitted one.</summary>
    public DepthMapping Apply(DepthMapping m, Random? rng)
    {
        var cx = m.CoreKnots.ToList();
        var cy = m.CompositeKnots.ToList();
        if (_extendBottom && _bottom > cx[^1] + 1e-9 * Math.Max(1, Math.Abs(_bottom)))
        {
            var (xs, ys) = Walk(m, cx[^1], cx[0], _bottom - cx[^1], rng);
            cx.AddRange(xs);
            cy.AddRange(ys);
        }
        if (_extendTop && _top < cx[0] - 1e-9 * Math.Max(1, Math.Abs(_top)))
        {
            var (xs, ys) = Walk(m, cx[0], cx[^1], cx[0] - _top, rng);
            xs.Reverse();
            ys.Reverse();
            cx.InsertRange(0, xs);
            cy.InsertRange(0, ys);
        }
        return cx.Count == m.CoreKnots.Count ? m : new DepthMapping(m.CoreId, m.Unit, [.. cx], [.. cy]);
    }

    /// <summary>Knots from the matched end <paramref name="from"/> outwards over <paramref name="distance"/>, away from <paramref name="inner"/>.</summary>
    private (List<double> X, List<double> Y) Walk(DepthMapping m, double from, double inner, double distance, Random? rng)
    {
        double sign = inner < from ? 1 : -1;
        double fit = Math.Min(Math.Max(2 * distance, MinFitSteps * _gridStep), Math.Abs(from - inner));
        double ratio = fit > 0 ? sign * (m.ToCompositeValue(from) - m.ToCompositeValue(from - sign * fit)) / fit : 1;
        // A short or poorly matched stretch can give an extreme ratio; keep it within a factor of
        // MaxRatioDeparture of the ties' mean ratio.
        if (!(ratio > 0)) ratio = _tieRatio;
        ratio = Math.Clamp(ratio, _tieRatio / MaxRatioDeparture, _tieRatio * MaxRatioDeparture);
        int knots = Math.Clamp((int)Math.Ceiling(distance / _gridStep), 1, MaxWalkKnots);
        double dx = distance / knots, y = m.ToCompositeValue(from);
        double rho = Math.Exp(-dx / _window), innovation = _spread * Math.Sqrt(1 - rho * rho);
        double logRatio = Math.Log(ratio) + (rng is null || fit <= 0 ? 0 : _spread * Math.Sqrt(Math.Min(1, _window / fit)) * Normal(rng));
        double departure = 0;
        var xs = new List<double>(knots);
        var ys = new List<double>(knots);
        for (int k = 1; k <= knots; k++)
        {
            if (rng is not null) departure = rho * departure + innovation * Normal(rng);
            y += sign * dx * Math.Exp(logRatio + departure);
            xs.Add(from + sign * k * dx);
            ys.Add(y);
        }
        return (xs, ys);
    }

    private static double Normal(Random rng)
    {
        double u1 = 1 - rng.NextDouble(), u2 = rng.NextDouble();
        return Math.Sqrt(-2 * Math.Log(u1)) * Math.Cos(2 * Math.PI * u2);
    }
}
