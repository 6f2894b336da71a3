using StratLink.Quantities;

namespace StratLink.Alignment;

/// <summary>
/// Continues a mapping over the part of a core that runs past the reference, where nothing is
/// compared. Composite depth departs from the aligned part's long-run line (the rate ratio two
/// cores keep over many rate changes) by offsets that come and go with those changes, so the
/// continuation heads from the matched end back towards that line: at the long-run ratio from a
/// level (the mean offset over the last <see cref="LevelLengths"/> correlation lengths of the
/// offsets, so one wiggle at the end does not place the rest), the matched end's own offset from
/// that level decaying over one correlation length (the best predictor of a first-order
/// autoregressive offset from its last value). The long-run ratio is the aligned part's
/// least-squares ratio, averaged with the ties' mean ratio where there are two ties or more (two
/// estimates of one ratio); held within a factor 2 of the ties' ratio. Ensemble members add the
/// errors of that prediction, measured on the aligned part: the long-run ratio's (s x
/// sqrt(window / aligned length), s the spread of the optimal mapping's log rate ratio over adjacent
/// windows), the level's (the offsets' standard deviation over the independent values in its
/// stretch) and the offset's own departure, a first-order autoregressive process with the offsets'
/// standard deviation and correlation length; so the band widens with distance from the last
/// matched sample. What the same extrapolation, tried inside the aligned part, errs by beyond that
/// is added as one shift per member (see <see cref="HindcastExcess"/>).
/// </summary>
internal sealed class EndExtension
{
    private const int MinFitSteps = 10;
    private const int MaxWalkKnots = 50;
    private const double MaxRatioDeparture = 2;

    /// <summary>Largest spread of log rate ratio used (a factor of about 1.65 at 1 sigma): a path's own jitter must not pass for rate changes.</summary>
    private const double MaxSpread = 0.5;

    /// <summary>
    /// The level is the mean offset over this many correlation lengths of the offsets (about two
    /// independent values, halving the variance one end value has); a longer stretch would average
    /// more but reach back to where the long-run ratio's error, times the distance, exceeds that
    /// gain (our choice).
    /// </summary>
    private const double LevelLengths = 4;

    private readonly double _top, _bottom, _gridStep, _spread, _window, _ratio, _fit, _offsetLength, _offsetDeviation, _levelLength;
    private readonly bool _extendTop, _extendBottom;

    /// <summary>Hindcast error beyond the members' modelled error, in core depth at unit ratio, every <see cref="_excessLag"/> from the matched end.</summary>
    private readonly double[] _excess;
    private readonly double _excessLag;
    private readonly IReadOnlyList<TiePoint> _ties;

    private EndExtension(double top, double bottom, double gridStep, double spread, double window, double ratio, double fit, (double Length, double Deviation) offsets,
        bool extendTop, bool extendBottom, double[] excess, double excessLag, IReadOnlyList<TiePoint> ties)
    {
        (_top, _bottom, _gridStep, _spread, _window, _ratio, _fit) = (top, bottom, gridStep, spread, window, ratio, fit);
        (_offsetLength, _offsetDeviation) = offsets;
        _levelLength = LevelLength(fit, _offsetLength, gridStep);
        (_extendTop, _extendBottom, _excess, _excessLag, _ties) = (extendTop, extendBottom, excess, excessLag, ties);
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
        var grid = new AlignedGrid(optimal, gridStep);
        bool tiedRatio = ties.Select(t => t.CoreDepth).Distinct().Count() >= 2;
        double tieRatio = overhang.MeanTieRatio;
        double ratio = LongRunRatio(grid.Slope(0, grid.Count - 1), tieRatio, tiedRatio);
        var offsets = grid.Offsets();
        var excess = HindcastExcess(grid, spread, window, tieRatio, tiedRatio, offsets, out double lag);
        return new EndExtension(coreTop, coreBottom, gridStep, spread, window, ratio, Math.Max(length, gridStep), offsets,
            overhang.Top > 0, overhang.Bottom > 0, excess, lag, ties);
    }

    /// <summary>The least-squares ratio, averaged with the ties' mean ratio where two ties or more give one, within a factor 2 of the ties' ratio.</summary>
    private static double LongRunRatio(double fitted, double tieRatio, bool tiedRatio)
    {
        double ratio = fitted > 0 ? (tiedRatio ? (fitted + tieRatio) / 2 : fitted) : tieRatio;
        // A short or poorly matched stretch can give an extreme ratio; keep it within a factor of
        // MaxRatioDeparture of the ties' mean ratio.
        return Math.Clamp(ratio, tieRatio / MaxRatioDeparture, tieRatio * MaxRatioDeparture);
    }

    /// <summary>
    /// The continuation's error the members' modelled error does not account for, by distance: at each distance d
    /// (a step of <see cref="HindcastLag"/>), the same extrapolation is tried inside the aligned part
    /// (from each sample, the long-run ratio fitted over all of the aligned part before it, at least
    /// max(2d, 10 steps), and the level over the stretch next to it, carried d beyond it, against the
    /// optimal mapping there; both directions), and what its RMS error exceeds that model's standard
    /// deviation by (in quadrature) is kept, as a running maximum so it does not shrink with
    /// distance. The measured errors miss rate changes longer than the aligned part resolves and
    /// excursions the offsets' one correlation length does not describe: empirical prediction intervals from past
    /// forecast errors (Williams and Goodman 1971, from memory). Distances are tried up to a quarter
    /// of the aligned length so that each rests on several independent stretches; beyond, the last
    /// value is held.
    /// </summary>
    private static double[] HindcastExcess(AlignedGrid grid, double spread, double window, double tieRatio, bool tiedRatio, (double Length, double Deviation) offsets, out double lag)
    {
        double step = grid.Step, length = grid.Length;
        lag = HindcastLag(step, length);
        var excess = new List<double> { 0 };
        for (double d = lag; d <= length / 4; d += lag)
        {
            double fit = Math.Max(2 * d, MinFitSteps * step);
            if (fit + d > 0.75 * length) break;
            int before = (int)Math.Ceiling(fit / step - 1e-9), ahead = (int)Math.Ceiling(d / step - 1e-9);
            double sum = 0;
            int count = 0;
            for (int k = before; k + ahead < grid.Count; k++)
            {
                sum += Error(k, 1, 0, k);
                count++;
            }
            for (int k = grid.Count - 1 - before; k - ahead >= 0; k--)
            {
                sum += Error(k, -1, k, grid.Count - 1);
                count++;
            }
            double observed = count > 0 ? sum / count : 0;
            excess.Add(Math.Max(excess[^1], Math.Sqrt(Math.Max(0, observed))));

            // Squared error beyond the modelled variance of the extrapolation from sample k outwards
            // (sign), the ratio fitted over samples k0-k1, in core depth at unit ratio.
            double Error(int k, int sign, int k0, int k1)
            {
                double ratio = LongRunRatio(grid.Slope(k0, k1), tieRatio, tiedRatio);
                double fitted = (k1 - k0) * step;
                double levelLength = LevelLength(fitted, offsets.Length, step);
                int levelSamples = (int)Math.Floor(levelLength / step + 1e-9);
                double level = sign > 0 ? grid.Level(k - levelSamples, k, k, ratio) : grid.Level(k, k + levelSamples, k, ratio);
                double predicted = level + sign * ratio * d + (grid.Value(k) - level) * Math.Exp(-d / offsets.Length);
                double error = sign * (grid.Mapping.ToCompositeValue(grid.Position(k) + sign * d) - predicted) / ratio;
                double model = ModelDeviation(d, fitted, spread, window, offsets, levelLength, ratio);
                return error * error - model * model;
            }
        }
        return [.. excess];
    }

    private static double HindcastLag(double gridStep, double length) => Math.Max(gridStep, length / 200);

    private static double LevelLength(double fit, double offsetLength, double gridStep) => Math.Min(fit, Math.Max(LevelLengths * offsetLength, MinFitSteps * gridStep));

    /// <summary>Variance of the level: the offsets' variance over the independent values (one per two correlation lengths) in its stretch.</summary>
    private static double LevelVariance((double Length, double Deviation) offsets, double levelLength) =>
        offsets.Deviation * offsets.Deviation * Math.Min(1, 2 * offsets.Length / Math.Max(levelLength, 1e-12));

    /// <summary>
    /// Standard deviation, in core depth at unit ratio, of a member's departure from the
    /// continuation <paramref name="d"/> beyond the matched end: the long-run ratio's error times d,
    /// the level's error (the offsets' mean over the level's stretch) and the offset's own
    /// first-order autoregressive departure from its prediction.
    /// </summary>
    private static double ModelDeviation(double d, double fit, double spread, double window, (double Length, double Deviation) offsets, double levelLength, double ratio)
    {
        double ratioError = spread * Math.Sqrt(Math.Min(1, window / fit)) * d;
        double level = LevelVariance(offsets, levelLength);
        double offset = offsets.Deviation * offsets.Deviation * (1 - Math.Exp(-2 * d / offsets.Length));
        return Math.Sqrt(ratioError * ratioError + (level + offset) / (ratio * ratio));
    }

    /// <summary>
    /// The core depths within which the members' median is their median: at an end that is
    /// continued, the median of the members' matched ends (their last matched sample); elsewhere
    /// unbounded.
    /// </summary>
    public (double Top, double Bottom) MatchedSpan(IReadOnlyList<DepthMapping> matched)
    {
        double top = double.NegativeInfinity, bottom = double.PositiveInfinity;
        if (matched.Count == 0) return (top, bottom);
        if (_extendTop) top = Statistics.PercentileSorted([.. matched.Select(m => m.CoreKnots[0]).Order()], 50);
        if (_extendBottom) bottom = Statistics.PercentileSorted([.. matched.Select(m => m.CoreKnots[^1]).Order()], 50);
        return (top, bottom);
    }

    /// <summary>The mapping continued to the core's ends; with <paramref name="rng"/> one ensemble member's, without it the prediction.</summary>
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
        double ratio = _ratio;
        double y0 = m.ToCompositeValue(from);
        // Each member's own matched end and the stretch before it: where a member leaves the record
        // moves its level only by that stretch's mean, and its end's offset fades.
        double level = y0;
        int levelSamples = (int)Math.Floor(Math.Min(_levelLength, Math.Abs(from - inner)) / _gridStep + 1e-9);
        if (levelSamples > 0)
        {
            double sum = 0;
            for (int k = 0; k <= levelSamples; k++) sum += m.ToCompositeValue(from - sign * k * _gridStep) + sign * ratio * k * _gridStep;
            level = sum / (levelSamples + 1);
        }
        double Centre(double d) => level + sign * ratio * d + (y0 - level) * Math.Exp(-d / _offsetLength);
        int knots = Math.Clamp((int)Math.Ceiling(distance / _gridStep), 1, MaxWalkKnots);
        // Ties past the matched end (markers carried through other cores) place the continuation:
        // it follows straight lines between them and the rate ratio beyond the last, each member
        // moving a tie's position by its uncertainty.
        var beyond = new List<(double D, double Shift)> { (0, 0) };
        foreach (var t in _ties.OrderBy(t => sign * t.CoreDepth))
        {
            double d = sign * (t.CoreDepth - from);
            if (d <= 0 || d > distance || sign * (t.CompositeDepth - (beyond.Count > 1 ? Centre(beyond[^1].D) + beyond[^1].Shift : y0)) <= 0) continue;
            double shift = t.CompositeDepth - Centre(d);
            if (rng is not null) shift += t.Uncertainty * Normal(rng);
            beyond.Add((d, shift));
        }
        var at = Enumerable.Range(1, knots).Select(k => k * distance / knots).Concat(beyond.Skip(1).Select(b => b.D)).Distinct().Order().ToArray();
        // The long-run ratio's error as a log-normal factor of mean 1, so the members' mean ratio
        // stays the long-run one; the level's error as one shift; the offset as a first-order
        // autoregressive process from the predicted one.
        double ratioError = _spread * Math.Sqrt(Math.Min(1, _window / _fit));
        double ratioFactor = rng is null ? 1 : Math.Exp(ratioError * Normal(rng) - ratioError * ratioError / 2);
        // One draw per member: the error the model misses shifts the whole continuation, growing
        // with distance as the hindcast's does.
        double excessDraw = rng is null ? 0 : Normal(rng);
        double levelShift = rng is null ? 0 : Math.Sqrt(LevelVariance((_offsetLength, _offsetDeviation), _levelLength)) * Normal(rng);
        double offset = 0, reached = 0;
        var xs = new List<double>(at.Length);
        var ys = new List<double>(at.Length);
        foreach (double d in at)
        {
            double dx = d - reached;
            reached = d;
            if (rng is not null)
            {
                double rho = Math.Exp(-dx / _offsetLength);
                offset = rho * offset + _offsetDeviation * Math.Sqrt(1 - rho * rho) * Normal(rng);
            }
            double placed = Centre(d) + sign * ratio * ((ratioFactor - 1) * d + ExcessAt(d) * excessDraw) + levelShift + offset + TieShift(beyond, d);
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

    /// <summary>The optimal mapping of the aligned part sampled every grid step, with running sums for least-squares fits over any stretch.</summary>
    private sealed class AlignedGrid
    {
        private readonly double[] _y, _sx, _sy, _sxx, _sxy;

        public AlignedGrid(DepthMapping mapping, double step)
        {
            Mapping = mapping;
            Step = step;
            Top = mapping.CoreKnots[0];
            Length = mapping.CoreKnots[^1] - Top;
            Count = Math.Max(2, (int)Math.Floor(Length / step + 1e-9) + 1);
            _y = new double[Count];
            (_sx, _sy, _sxx, _sxy) = (new double[Count + 1], new double[Count + 1], new double[Count + 1], new double[Count + 1]);
            for (int k = 0; k < Count; k++)
            {
                // Positions relative to the top keep the sums well conditioned.
                double u = Math.Min(k * step, Length);
                _y[k] = mapping.ToCompositeValue(Top + u);
                _sx[k + 1] = _sx[k] + u;
                _sy[k + 1] = _sy[k] + _y[k];
                _sxx[k + 1] = _sxx[k] + u * u;
                _sxy[k + 1] = _sxy[k] + u * _y[k];
            }
        }

        public DepthMapping Mapping { get; }
        public double Step { get; }
        public double Top { get; }
        public double Length { get; }
        public int Count { get; }

        public double Position(int k) => Top + Math.Min(k * Step, Length);
        public double Value(int k) => _y[k];

        /// <summary>Least-squares slope over samples <paramref name="k0"/>-<paramref name="k1"/>.</summary>
        public double Slope(int k0, int k1)
        {
            int n = k1 - k0 + 1;
            if (n < 2) return double.NaN;
            double sx = _sx[k1 + 1] - _sx[k0], sy = _sy[k1 + 1] - _sy[k0];
            double sxx = _sxx[k1 + 1] - _sxx[k0] - sx * sx / n, sxy = _sxy[k1 + 1] - _sxy[k0] - sx * sy / n;
            return sxx > 0 ? sxy / sxx : double.NaN;
        }

        /// <summary>Value at sample <paramref name="at"/> of the line of slope <paramref name="ratio"/> through the mean of samples <paramref name="k0"/>-<paramref name="k1"/>.</summary>
        public double Level(int k0, int k1, int at, double ratio)
        {
            int n = k1 - k0 + 1;
            double mx = (_sx[k1 + 1] - _sx[k0]) / n, my = (_sy[k1 + 1] - _sy[k0]) / n;
            return my + ratio * (Math.Min(at * Step, Length) - mx);
        }

        /// <summary>
        /// Correlation length and standard deviation of the offsets from the least-squares line over
        /// the whole aligned part: step x (1/2 + sum of rho_k), the sum stopped at the first
        /// non-positive rho_k (Geyer's initial positive sequence, as for the path's autocorrelation time).
        /// </summary>
        public (double Length, double Deviation) Offsets()
        {
            double slope = Slope(0, Count - 1);
            if (double.IsNaN(slope)) return (Step, 0);
            double mean = _sy[Count] / Count, mx = _sx[Count] / Count;
            var r = new double[Count];
            double c0 = 0;
            for (int k = 0; k < Count; k++)
            {
                r[k] = _y[k] - mean - slope * (Math.Min(k * Step, Length) - mx);
                c0 += r[k] * r[k];
            }
            if (!(c0 > 1e-12 * Math.Max(1, mean * mean) * Count)) return (Step, 0);
            double sum = 0.5;
            for (int lag = 1; lag < Count / 2; lag++)
            {
                double c = 0;
                for (int k = 0; k + lag < Count; k++) c += r[k] * r[k + lag];
                double rho = c / c0;
                if (rho <= 0) break;
                sum += rho;
            }
            return (Step * sum, Math.Sqrt(c0 / Count));
        }
    }
}
