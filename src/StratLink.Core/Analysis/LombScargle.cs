namespace StratLink.Analysis;

/// <summary>
/// Lomb-Scargle periodogram for unevenly spaced times (Lomb 1976, Ap&amp;SS 39:447; Scargle 1982,
/// ApJ 263:835): P(w) = 1/(2 s^2) {[S y cos w(t-tau)]^2 / S cos^2 w(t-tau) + [S y sin w(t-tau)]^2 / S sin^2 w(t-tau)},
/// tan 2w tau = S sin 2wt / S cos 2wt, y with its mean removed.
/// </summary>
public static class LombScargle
{
    /// <summary>Power at each of <paramref name="frequencies"/> (cycles per unit of <paramref name="times"/>), evaluated directly.</summary>
    public static double[] Power(ReadOnlySpan<double> times, ReadOnlySpan<double> values, ReadOnlySpan<double> frequencies,
        LombScargleNormalisation normalisation = LombScargleNormalisation.Psd)
    {
        var (t, y, ss) = Prepare(times, values);
        var p = new double[frequencies.Length];
        for (int k = 0; k < p.Length; k++)
        {
            double w = 2 * Math.PI * frequencies[k];
            double c2 = 0, s2 = 0, syc = 0, sys = 0;
            for (int i = 0; i < t.Length; i++)
            {
                double c = Math.Cos(w * t[i]), s = Math.Sin(w * t[i]);
                c2 += c * c - s * s;
                s2 += 2 * c * s;
                syc += y[i] * c;
                sys += y[i] * s;
            }
            p[k] = RawPower(t.Length, c2, s2, syc, sys);
        }
        Normalise(p, ss, t.Length, normalisation);
        return p;
    }

    /// <summary>Power on an even frequency grid; same values as <see cref="Power"/>, computed with trigonometric recurrences.</summary>
    public static double[] PowerOnGrid(ReadOnlySpan<double> times, ReadOnlySpan<double> values, FrequencyGrid grid,
        LombScargleNormalisation normalisation = LombScargleNormalisation.Psd)
    {
        var (t, y, ss) = Prepare(times, values);
        var p = new double[grid.Count];
        AccumulateRaw(t, y, 1, grid, p, 1.0);
        Normalise(p, ss, t.Length, normalisation);
        return p;
    }

    /// <summary>Times centred on their midpoint (keeps the phase arguments small) and values minus their mean.</summary>
    private static (double[] T, double[] Y, double SumSquares) Prepare(ReadOnlySpan<double> times, ReadOnlySpan<double> values)
    {
        if (times.Length != values.Length) throw new ArgumentException($"{times.Length} times for {values.Length} values.");
        if (times.Length < 3) throw new ArgumentException("A periodogram needs at least 3 samples.");
        double tMid = 0.5 * (Min(times) + Max(times));
        double mean = 0;
        foreach (double v in values) mean += v;
        mean /= values.Length;
        var t = new double[times.Length];
        var y = new double[times.Length];
        double ss = 0;
        for (int i = 0; i < t.Length; i++)
        {
            t[i] = times[i] - tMid;
            y[i] = values[i] - mean;
            ss += y[i] * y[i];
        }
        return (t, y, ss);
    }

    private static void Normalise(double[] raw, double sumSquares, int n, LombScargleNormalisation normalisation)
    {
        // raw = P * s^2 with s^2 the sample variance (N-1); standard = 2 raw / SS (VanderPlas 2018 eq. 63).
        double factor = normalisation switch
        {
            LombScargleNormalisation.Psd => (n - 1) / sumSquares,
            LombScargleNormalisation.Standard => 2 / sumSquares,
            _ => throw new ArgumentOutOfRangeException(nameof(normalisation)),
        };
        for (int k = 0; k < raw.Length; k++) raw[k] *= factor;
    }

    /// <summary>
    /// 1/2 {[S y cos]^2/S cos^2 + [S y sin]^2/S sin^2} at the tau of Scargle 1982, from the plain sums over
    /// cos wt and sin wt: with R = |(S cos 2wt, S sin 2wt)|, S cos^2 w(t-tau) = (n+R)/2 and S sin^2 = (n-R)/2
    /// (Press and Rybicki 1989, ApJ 338:277).
    /// </summary>
    private static double RawPower(int n, double c2, double s2, double syc, double sys)
    {
        var (cosTau, sinTau, cc, ssn) = TauTerms(n, c2, s2);
        double yc = syc * cosTau + sys * sinTau;
        double ys = sys * cosTau - syc * sinTau;
        return 0.5 * (yc * yc / cc + (ssn > 1e-10 * n ? ys * ys / ssn : 0));
    }

    private static (double CosTau, double SinTau, double SumCos2, double SumSin2) TauTerms(int n, double c2, double s2)
    {
        double r = Math.Sqrt(c2 * c2 + s2 * s2);
        double half = 0.5 * Math.Atan2(s2, c2);
        return (Math.Cos(half), Math.Sin(half), 0.5 * (n + r), 0.5 * (n - r));
    }

    /// <summary>
    /// Adds <paramref name="scale"/> times the raw power of <paramref name="batch"/> series sharing the times
    /// <paramref name="t"/> to <paramref name="output"/> (layout [k * batch + b]). Values are laid out
    /// [i * batch + b] and must already have their mean (or trend) removed. The trigonometric terms are
    /// advanced by recurrence and shared by the whole batch; they are recomputed exactly every 256 steps
    /// so rounding cannot drift.
    /// </summary>
    internal static void AccumulateRaw(ReadOnlySpan<double> t, ReadOnlySpan<double> y, int batch, FrequencyGrid grid, Span<double> output, double scale)
    {
        int n = t.Length;
        var cos = new double[n];
        var sin = new double[n];
        var cosStep = new double[n];
        var sinStep = new double[n];
        double dw = 2 * Math.PI * grid.Step;
        for (int i = 0; i < n; i++)
        {
            cosStep[i] = Math.Cos(dw * t[i]);
            sinStep[i] = Math.Sin(dw * t[i]);
        }
        var syc = new double[batch];
        var sys = new double[batch];
        for (int k = 0; k < grid.Count; k++)
        {
            if (k % 256 == 0)
            {
                double w = 2 * Math.PI * grid.Frequency(k);
                for (int i = 0; i < n; i++)
                {
                    cos[i] = Math.Cos(w * t[i]);
                    sin[i] = Math.Sin(w * t[i]);
                }
            }
            double c2 = 0, s2 = 0;
            Array.Clear(syc);
            Array.Clear(sys);
            for (int i = 0; i < n; i++)
            {
                double c = cos[i], s = sin[i];
                c2 += c * c - s * s;
                s2 += 2 * c * s;
                int row = i * batch;
                for (int b = 0; b < batch; b++)
                {
                    double v = y[row + b];
                    syc[b] += v * c;
                    sys[b] += v * s;
                }
                cos[i] = c * cosStep[i] - s * sinStep[i];
                sin[i] = s * cosStep[i] + c * sinStep[i];
            }
            var (cosTau, sinTau, cc, ssn) = TauTerms(n, c2, s2);
            bool sinUsable = ssn > 1e-10 * n;
            int outRow = k * batch;
            for (int b = 0; b < batch; b++)
            {
                double yc = syc[b] * cosTau + sys[b] * sinTau;
                double ys = sys[b] * cosTau - syc[b] * sinTau;
                output[outRow + b] += scale * 0.5 * (yc * yc / cc + (sinUsable ? ys * ys / ssn : 0));
            }
        }
    }

    private static double Min(ReadOnlySpan<double> v)
    {
        double m = double.PositiveInfinity;
        foreach (double x in v) m = Math.Min(m, x);
        return m;
    }

    private static double Max(ReadOnlySpan<double> v)
    {
        double m = double.NegativeInfinity;
        foreach (double x in v) m = Math.Max(m, x);
        return m;
    }
}
