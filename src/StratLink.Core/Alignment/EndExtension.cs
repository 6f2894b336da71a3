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
/// the mean's error is s x sqrt(window / fitted stretch). What the same extrapolation, tried inside the
/// aligned part, errs by beyond that walk is added as one shift per member (see <see cref="HindcastExcess"/>).
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

    /// <summary>Hindcast error beyond the walk's, in core depth at unit ratio, every <see cref="_excessLag"/> from the matched end.</summary>
    private readonly double[] _excess;
    private readonly double _excessLag;
    private readonly IReadOnlyList<TiePoint> _ties;

    private EndExtension(double top, double bottom, double gridStep, double spread, double window, double tieRatio, bool extendTop, bool extendBottom, double[] excess, double excessLag, IReadOnlyList<TiePoint> ties)
    {
        (_top, _bottom, _gridStep, _spread, _window, _tieRatio, _extendTop, _extendBottom) = (top, bottom, gridStep, spread, window, tieRatio, extendTop, extendBottom);
        (_excess, _excessLag, _ties) = (excess, excessLag, ties);
    }

    private double ExcessAt(double distance)
    {
        double r = distance / _excessLag;
        int i = (int)Math.Floor(r);
        if (i >= _excess.Length - 1) return _excess[^1];
        return _excess[i] + (r - i) * (_excess[i + 1] - _excess[i]);
    }

    public static EndExtension Measure(DepthMapping optimal, double coreTop, double coreBottom, double gridStep, CoreOverhang overhang, IReadOnlyList<TiePoint> ties)
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
        spread = Math.Min(spread, MaxSpread);
        var excess = HindcastExcess(optimal, gridStep, spread, window, overhang.MeanTieRatio, out double lag);
        return new EndExtension(coreTop, coreBottom, gridStep, spread, window, overhang.MeanTieRatio, overhang.Top > 0, overhang.Bottom > 0, excess, lag, ties);
    }

    /// <summary>
    /// The continuation's error the walk does not account for, by distance: at each distance d
    /// (a step of <see cref="HindcastLag"/>), the same extrapolation is tried inside the aligned part
    /// (from each sample, the rate fitted over max(2d, 10 steps) before it carried d beyond it,
    /// against the optimal mapping there; both directions), and what its RMS error exceeds the walk's
    /// standard deviation by (in quadrature) is kept, as a running maximum so it does not shrink
    /// with distance. The window-scale spread misses rate changes shorter than a window, which a
    /// continuation near the matched end meets first: empirical prediction intervals from past
    /// forecast errors (Williams and Goodman 1971, from memory). Distances are tried up to a quarter
    /// of the aligned length so that each rests on several independent stretches; beyond, the last
    /// value is held.
    /// </summary>
    private static double[] HindcastExcess(DepthMapping optimal, double gridStep, double spread, double window, double tieRatio, out double lag)
    {
        var x = optimal.CoreKnots;
        double x0 = x[0], x1 = x[^1], length = x1 - x0;
        lag = HindcastLag(gridStep, length);
        var excess = new List<double> { 0 };
        for (double d = lag; d <= length / 4; d += lag)
        {
            double fit = Math.Max(2 * d, MinFitSteps * gridStep);
            if (fit + d > 0.75 * length) break;
            double sum = 0;
            int count = 0;
            foreach (double sign in (double[])[1, -1])
            {
                for (double a = sign > 0 ? x0 + fit : x1 - fit; sign > 0 ? a + d <= x1 : a - d >= x0; a += sign * gridStep)
                {
                    double ya = optimal.ToCompositeValue(a);
                    double ratio = sign * (ya - optimal.ToCompositeValue(a - sign * fit)) / fit;
                    // Held within the walk's own limits: a stretch run along one column (a squeeze
                    // at an end) has a ratio near 0, and dividing by it is no forecast the walk makes.
                    if (!(ratio > 0)) continue;
                    ratio = Math.Clamp(ratio, tieRatio / MaxRatioDeparture, tieRatio * MaxRatioDeparture);
                    double error = (optimal.ToCompositeValue(a + sign * d) - ya) / (sign * ratio) - d;
                    sum += error * error;
                    count++;
                }
            }
            double model = ModelDeviation(d, fit, spread, window);
            double observed = count > 0 ? sum / count : 0;
            excess.Add(Math.Max(excess[^1], Math.Sqrt(Math.Max(0, observed - model * model))));
        }
        return [.. excess];
    }

    private static double HindcastLag(double gridStep, double length) => Math.Max(gridStep, length / 200);

    /// <summary>Standard deviation, in core depth at unit ratio, of the walk's departure after <paramref name="d"/>: the fitted mean's error times d, plus the integrated Ornstein-Uhlenbeck process.</summary>
    private static double ModelDeviation(double d, double fit, double spread, double window)
    {
        double meanError = spread * Math.Sqrt(Math.Min(1, window / fit)) * d;
        double walk = spread * spread * 2 * window * window * (d / window - 1 + Math.Exp(-d / window));
        return Math.Sqrt(meanError * meanError + walk);
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
        double y0 = m.ToCompositeValue(from);
        // Ties past the matched end (markers carried through other cores) place the continuation:
        // it follows straight lines between them and the rate ratio beyond the last, each member
        // moving a tie's position by its uncertainty.
        var beyond = new List<(double D, double Shift)> { (0, 0) };
        foreach (var t in _ties.OrderBy(t => sign * t.CoreDepth))
        {
            double d = sign * (t.CoreDepth - from);
            if (d <= 0 || d > distance || sign * (t.CompositeDepth - (beyond.Count > 1 ? y0 + sign * ratio * beyond[^1].D + beyond[^1].Shift : y0)) <= 0) continue;
            double shift = t.CompositeDepth - (y0 + sign * ratio * d);
            if (rng is not null) shift += t.Uncertainty * Normal(rng);
            beyond.Add((d, shift));
        }
        var at = Enumerable.Range(1, knots).Select(k => k * distance / knots).Concat(beyond.Skip(1).Select(b => b.D)).Distinct().Order().ToArray();
        double y = y0, reached = 0;
        // Log-normal departures of variance v raise the mean ratio by exp(v/2); taking v/2 off keeps
        // the fitted ratio the members' mean, so a wider spread widens the band without moving it.
        double meanError = fit <= 0 ? 0 : _spread * Math.Sqrt(Math.Min(1, _window / fit));
        double logRatio = Math.Log(ratio) + (rng is null ? 0 : meanError * Normal(rng) - (meanError * meanError + _spread * _spread) / 2);
        double departure = 0;
        // One draw per member: the short-scale error shifts the whole continuation, growing with
        // distance as the hindcast's does.
        double excessDraw = rng is null ? 0 : Normal(rng);
        var xs = new List<double>(at.Length);
        var ys = new List<double>(at.Length);
        foreach (double d in at)
        {
            double dx = d - reached;
            reached = d;
            if (rng is not null)
            {
                double rho = Math.Exp(-dx / _window);
                departure = rho * departure + _spread * Math.Sqrt(1 - rho * rho) * Normal(rng);
            }
            y += sign * dx * Math.Exp(logRatio + departure);
            double placed = y + sign * ratio * ExcessAt(d) * excessDraw + TieShift(beyond, d);
            // Composite depth keeps increasing with core depth.
            double previous = ys.Count > 0 ? ys[^1] : y0;
            xs.Add(from + sign * d);
            ys.Add(sign > 0 ? Math.Max(placed, previous) : Math.Min(placed, previous));
        }
        return (xs, ys);
    }

    /// <summary>The ties' shifts from the fitted continuation, linear between them, held beyond the last.</summary>
    private static double TieShift(List<(double D, double Shift)> beyond, double d)
    {
        for (int k = 1; k < beyond.Count; k++)
        {
            if (d > beyond[k].D) continue;
            var (a, b) = (beyond[k - 1], beyond[k]);
            return a.Shift + (b.Shift - a.Shift) * (d - a.D) / (b.D - a.D);
        }
        return beyond[^1].Shift;
    }

    private static double Normal(Random rng)
    {
        double u1 = 1 - rng.NextDouble(), u2 = rng.NextDouble();
        return Math.Sqrt(-2 * Math.Log(u1)) * Math.Cos(2 * Math.PI * u2);
    }
}
