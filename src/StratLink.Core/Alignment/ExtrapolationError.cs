namespace StratLink.Alignment;

/// <summary>
/// How far a straight continuation at the long-run rate ratio errs with distance, measured on
/// mappings where the truth is seen (each core's median mapping over the part it maps inside the
/// reference): from every start sample, the departure of the mapping d further on (either way,
/// the same pairs) from the line through the start at the core's least-squares ratio is the
/// increment of the mapping's residual about that line, so its mean square is twice the
/// residual's semivariogram at lag d, estimated by the method of moments (Matheron 1963, Economic
/// Geology 58:1246-1266, from memory). Lags reach half of each record (common practice for
/// empirical variograms, Journel and Huijbregts 1978, from memory), in composite depth the lag
/// times the core's ratio; several records are pooled at each distance weighted by their pairs.
/// </summary>
internal sealed class ExtrapolationError
{
    /// <summary>Lags are measured up to this share of a record (beyond, too few independent pairs).</summary>
    private const double MaxLagShare = 0.5;

    private readonly double _step;
    private readonly double[] _meanSquare;

    private ExtrapolationError(double step, double[] meanSquare) => (_step, _meanSquare) = (step, meanSquare);

    /// <summary>The largest composite distance measured; beyond it <see cref="At"/> holds its last value.</summary>
    public double Reach => _step * (_meanSquare.Length - 1);

    /// <summary>
    /// Pooled over <paramref name="records"/> (per record the core depths of equally spaced samples,
    /// ascending, and the composite depths the mapping gives them; at least 10 samples and a positive
    /// ratio), at every
    /// <paramref name="step"/> of composite distance; null where no record has.
    /// </summary>
    public static ExtrapolationError? Measure(IEnumerable<(double[] CoreDepths, double[] CompositeDepths)> records, double step)
    {
        var sums = new List<double>();
        var weights = new List<double>();
        foreach (var (x, y) in records)
        {
            int n = x.Length;
            if (n < 10) continue;
            var (residual, ratio) = Residual(x, y);
            if (!(ratio > 0)) continue;
            double spacing = (x[^1] - x[0]) / (n - 1);
            int maxLag = (int)Math.Floor(MaxLagShare * (n - 1));
            // Mean square increment at every lag in samples, then read at composite distances.
            var v = new double[maxLag + 1];
            for (int lag = 1; lag <= maxLag; lag++)
            {
                double s = 0;
                for (int i = 0; i + lag < n; i++) s += (residual[i + lag] - residual[i]) * (residual[i + lag] - residual[i]);
                v[lag] = s / (n - lag);
            }
            for (int j = 0; ; j++)
            {
                double lag = j * step / (ratio * spacing);
                if (lag > maxLag) break;
                int l0 = (int)Math.Floor(lag), l1 = Math.Min(l0 + 1, maxLag);
                double at = v[l0] + (lag - l0) * (v[l1] - v[l0]);
                double pairs = n - lag;
                while (sums.Count <= j) { sums.Add(0); weights.Add(0); }
                sums[j] += pairs * at;
                weights[j] += pairs;
            }
        }
        if (sums.Count == 0) return null;
        return new ExtrapolationError(step, [.. sums.Select((s, j) => s / weights[j])]);
    }

    /// <summary>Root mean square departure, in composite depth, of the continuation <paramref name="distance"/> (composite) from its start.</summary>
    public double At(double distance)
    {
        double r = Math.Abs(distance) / _step;
        int i = (int)Math.Floor(r);
        if (i >= _meanSquare.Length - 1) return Math.Sqrt(_meanSquare[^1]);
        return Math.Sqrt(_meanSquare[i] + (r - i) * (_meanSquare[i + 1] - _meanSquare[i]));
    }

    /// <summary>The residuals of <paramref name="y"/> about its least-squares line in <paramref name="x"/>, and the line's slope (the long-run ratio).</summary>
    private static (double[] Residual, double Ratio) Residual(double[] x, double[] y)
    {
        int n = x.Length;
        double mx = x.Average(), my = y.Average(), sxx = 0, sxy = 0;
        for (int i = 0; i < n; i++)
        {
            sxx += (x[i] - mx) * (x[i] - mx);
            sxy += (x[i] - mx) * (y[i] - my);
        }
        double ratio = sxy / sxx;
        var r = new double[n];
        for (int i = 0; i < n; i++) r[i] = y[i] - my - ratio * (x[i] - mx);
        return (r, ratio);
    }
}
