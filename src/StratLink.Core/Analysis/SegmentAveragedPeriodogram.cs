namespace StratLink.Analysis;

/// <summary>
/// Lomb-Scargle spectra averaged over half-overlapping, detrended and tapered segments (Welch 1967 overlapped
/// segment averaging on uneven times, Schulz and Mudelsee 2002). Scaled so white noise of variance s^2 has
/// level 2 dbar s^2 and the area up to the mean Nyquist frequency is its variance. Many series on the same
/// times are done in one pass, sharing the trigonometric work.
/// </summary>
internal sealed class SegmentAveragedPeriodogram
{
    private readonly double[][] _segmentTimes;
    private readonly double[][] _weights;
    private readonly double[] _scales;

    public SegmentAveragedPeriodogram(ReadOnlySpan<double> timesForward, SegmentLayout layout, TaperWindow taper, FrequencyGrid grid)
    {
        Layout = layout;
        Grid = grid;
        int m = layout.Length;
        int segments = layout.Starts.Length;
        _segmentTimes = new double[segments][];
        _weights = new double[segments][];
        _scales = new double[segments];
        for (int s = 0; s < segments; s++)
        {
            var t = timesForward.Slice(layout.Starts[s], m).ToArray();
            double t0 = t[0], t1 = t[m - 1], mid = 0.5 * (t0 + t1);
            var w = new double[m];
            double sw2 = 0;
            for (int i = 0; i < m; i++)
            {
                w[i] = taper.Weight(t1 > t0 ? (t[i] - t0) / (t1 - t0) : 0.5);
                sw2 += w[i] * w[i];
            }
            // Normalise the taper to S w^2 = m so tapering keeps the white-noise level.
            double norm = Math.Sqrt(m / sw2);
            for (int i = 0; i < m; i++)
            {
                w[i] *= norm;
                t[i] -= mid;
            }
            _segmentTimes[s] = t;
            _weights[s] = w;
            _scales[s] = 2 * ((t1 - t0) / (m - 1)) / segments;
        }
    }

    public SegmentLayout Layout { get; }
    public FrequencyGrid Grid { get; }

    /// <summary>
    /// Grid from 1/(oversampling * segment duration) up to <paramref name="highestFactor"/> times the mean Nyquist
    /// frequency 1/(2 dbar), segment duration = segment length * dbar.
    /// </summary>
    public static FrequencyGrid DefaultGrid(double meanSpacing, SegmentLayout layout, double oversampling, double highestFactor)
    {
        double step = 1 / (oversampling * layout.Length * meanSpacing);
        int count = (int)Math.Floor(highestFactor / (2 * meanSpacing) / step + 1e-9);
        return new FrequencyGrid(step, count);
    }

    /// <summary>Spectra of each series (each aligned with the times given at construction).</summary>
    public double[][] Compute(IReadOnlyList<double[]> series)
    {
        int batch = series.Count;
        int m = Layout.Length;
        var acc = new double[Grid.Count * batch];
        var y = new double[m * batch];
        var work = new double[m];
        for (int s = 0; s < _segmentTimes.Length; s++)
        {
            int start = Layout.Starts[s];
            for (int b = 0; b < batch; b++)
            {
                Array.Copy(series[b], start, work, 0, m);
                SegmentLayout.Detrend(_segmentTimes[s], work);
                for (int i = 0; i < m; i++) y[i * batch + b] = work[i] * _weights[s][i];
            }
            LombScargle.AccumulateRaw(_segmentTimes[s], y, batch, Grid, acc, _scales[s]);
        }
        var result = new double[batch][];
        for (int b = 0; b < batch; b++)
        {
            result[b] = new double[Grid.Count];
            for (int k = 0; k < Grid.Count; k++) result[b][k] = acc[k * batch + b];
        }
        return result;
    }
}
