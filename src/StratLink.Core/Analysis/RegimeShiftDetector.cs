using MathNet.Numerics.Distributions;

namespace StratLink.Analysis;

/// <summary>
/// Sequential t-test analysis of regime shifts (Rodionov 2004, GRL 31:L09204) with Huber weights (Rodionov 2006,
/// GRL 33:L12707), run forward in time: the record is read oldest first, so "before" is older.
/// diff = t(2l-2, p two-tailed) sqrt(2 sigma_l^2 / l), sigma_l^2 the mean variance of all l-sample windows; a
/// value outside the current regime mean +- diff is a candidate, accepted when the regime shift index
/// RSI = S w_i x*_i / (l sigma_l) stays positive over the next l samples (x* the excess over mean +- diff,
/// w_i = min(1, h / |x*_i / sigma_l|)). Regime means are Huber M-estimates iterated twice from the median.
/// The cut-off length counts samples, so on an uneven record it spans l times the local spacing.
/// </summary>
public static class RegimeShiftDetector
{
    /// <summary>Smallest difference of regime means significant at <paramref name="probability"/> (two-tailed).</summary>
    public static double CriticalDifference(int cutoffLength, double sigmaL, double probability) =>
        StudentT.InvCDF(0, 1, 2 * cutoffLength - 2, 1 - probability / 2) * Math.Sqrt(2 * sigmaL * sigmaL / cutoffLength);

    public static RegimeShiftResult Detect(AgeSeries series, RegimeShiftOptions options)
    {
        var r = Detect(series.Values, options);
        var shifts = r.Shifts.Select(s => s with { AgeBP = series.AgesBP[s.Index] }).ToList();
        return r with { Shifts = shifts };
    }

    /// <summary>Shifts in <paramref name="valuesForward"/> (oldest first); <see cref="RegimeShift.AgeBP"/> is NaN here.</summary>
    public static RegimeShiftResult Detect(ReadOnlySpan<double> valuesForward, RegimeShiftOptions options)
    {
        int l = options.CutoffLength;
        int n = valuesForward.Length;
        if (l < 2) throw new ArgumentOutOfRangeException(nameof(options), l, "The cut-off length must be at least 2 samples.");
        if (n < l + 1) throw new ArgumentException($"The record has {n} samples; the regime test with cut-off length {l} needs at least {l + 1}.");
        var x = valuesForward.ToArray();
        double sigmaL = Math.Sqrt(MeanWindowVariance(x, l));
        double diff = CriticalDifference(l, sigmaL, options.Probability);
        double h = options.HuberParameter;

        var starts = new List<int> { 0 };
        var rsis = new List<double>();
        var tentative = new List<bool>();
        int regimeStart = 0;
        double mean = HuberMean(x.AsSpan(0, l), sigmaL, h);
        for (int i = l; i < n; i++)
        {
            bool up = x[i] > mean + diff, down = x[i] < mean - diff;
            double rsi = 0;
            bool shift = false, complete = true;
            if ((up || down) && sigmaL > 0)
            {
                double bound = up ? mean + diff : mean - diff;
                shift = true;
                int end = Math.Min(n, i + l);
                complete = end == i + l;
                for (int j = i; j < end; j++)
                {
                    double excess = up ? x[j] - bound : bound - x[j];
                    double dev = Math.Abs(excess) / sigmaL;
                    double w = dev > h ? h / dev : 1;
                    rsi += w * excess / (l * sigmaL);
                    if (rsi < 0) { shift = false; break; }
                }
            }
            if (shift)
            {
                starts.Add(i);
                rsis.Add(rsi);
                tentative.Add(!complete);
                if (!complete) break;
                regimeStart = i;
                mean = HuberMean(x.AsSpan(i, l), sigmaL, h);
            }
            else if (i >= regimeStart + l)
            {
                mean = HuberMean(x.AsSpan(regimeStart, i - regimeStart + 1), sigmaL, h);
            }
        }

        var means = new double[starts.Count];
        var perSample = new double[n];
        for (int r = 0; r < starts.Count; r++)
        {
            int s = starts[r], e = r + 1 < starts.Count ? starts[r + 1] : n;
            means[r] = HuberMean(x.AsSpan(s, e - s), sigmaL, h);
            Array.Fill(perSample, means[r], s, e - s);
        }
        var shifts = new List<RegimeShift>();
        for (int r = 1; r < starts.Count; r++)
            shifts.Add(new RegimeShift(starts[r], double.NaN, means[r - 1], means[r], rsis[r - 1], tentative[r - 1]));
        return new RegimeShiftResult(shifts, perSample, diff, sigmaL, options);
    }

    /// <summary>Mean of the sample variances (n - 1) of every run of <paramref name="l"/> consecutive values.</summary>
    private static double MeanWindowVariance(double[] x, int l)
    {
        double total = 0;
        int windows = x.Length - l + 1;
        for (int s = 0; s < windows; s++)
        {
            double m = 0;
            for (int i = s; i < s + l; i++) m += x[i];
            m /= l;
            double v = 0;
            for (int i = s; i < s + l; i++) v += (x[i] - m) * (x[i] - m);
            total += v / (l - 1);
        }
        return total / windows;
    }

    /// <summary>Huber M-estimate of the mean: start at the median, weights min(1, h / |(x - m)/sigma|), two iterations.</summary>
    internal static double HuberMean(ReadOnlySpan<double> x, double sigma, double h)
    {
        if (double.IsPositiveInfinity(h) || !(sigma > 0))
        {
            double s = 0;
            foreach (double v in x) s += v;
            return s / x.Length;
        }
        var sorted = x.ToArray();
        Array.Sort(sorted);
        double m = Statistics.PercentileSorted(sorted, 50);
        for (int it = 0; it < 2; it++)
        {
            double sw = 0, swx = 0;
            foreach (double v in x)
            {
                double dev = Math.Abs(v - m) / sigma;
                double w = dev > h ? h / dev : 1;
                sw += w;
                swx += w * v;
            }
            m = swx / sw;
        }
        return m;
    }
}
