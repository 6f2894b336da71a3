namespace StratLink.Analysis;

/// <summary>
/// Gaussian-kernel filters for uneven times (Nadaraya-Watson; Rehfeld et al. 2011, NPG 18:389). The low-pass
/// is S w_i y_i / S w_i with w_i = exp(-(t_i - t)^2 / 2 sigma^2); on dense even sampling its amplitude gain is
/// G(f) = exp(-2 pi^2 sigma^2 f^2), the kernel's Fourier transform. G = 1/2 at f = 0.1874/sigma (half amplitude,
/// -6 dB: the value often quoted as the filter's cut-off) and G^2 = 1/2 at f = 0.1325/sigma (half power, -3 dB).
/// The band-pass shifts that Gaussian window to +-f0: 2 S w_i (y_i - mean) cos 2 pi f0 (t_i - t) / S w_i, gain
/// G(f - f0) + G(f + f0).
/// </summary>
public static class GaussianFilter
{
    /// <summary>sqrt(ln 2 / (2 pi^2)) = 0.18739: frequency times sigma where the amplitude gain is 1/2.</summary>
    public static readonly double HalfAmplitudeConstant = Math.Sqrt(Math.Log(2) / (2 * Math.PI * Math.PI));

    /// <summary>sqrt(ln 2 / (4 pi^2)) = 0.13250: frequency times sigma where the power gain is 1/2.</summary>
    public static readonly double HalfPowerConstant = Math.Sqrt(Math.Log(2) / (4 * Math.PI * Math.PI));

    /// <summary>Kernel cut at this many sigma (weight below 2e-8 of the centre's).</summary>
    private const double Reach = 6;

    public static double Gain(double sigmaYears, double frequency) =>
        Math.Exp(-2 * Math.PI * Math.PI * sigmaYears * sigmaYears * frequency * frequency);

    /// <summary>Frequency where the low-pass keeps half the power (gain^2 = 1/2), cycles per year.</summary>
    public static double HalfPowerFrequency(double sigmaYears) => HalfPowerConstant / sigmaYears;

    /// <summary>Frequency where the low-pass keeps half the amplitude (gain = 1/2), cycles per year.</summary>
    public static double HalfAmplitudeFrequency(double sigmaYears) => HalfAmplitudeConstant / sigmaYears;

    /// <summary>Sigma whose low-pass (or band-pass half-width) reaches half power at <paramref name="frequency"/>.</summary>
    public static double SigmaForHalfPower(double frequency) => HalfPowerConstant / frequency;

    /// <summary>Low-pass of (times, values) at <paramref name="at"/>; times ascending.</summary>
    public static double[] LowPass(ReadOnlySpan<double> times, ReadOnlySpan<double> values, double sigmaYears, ReadOnlySpan<double> at)
    {
        Check(times, values, sigmaYears);
        var result = new double[at.Length];
        for (int j = 0; j < at.Length; j++)
        {
            var (lo, hi) = Window(times, at[j], sigmaYears);
            double sw = 0, swy = 0;
            for (int i = lo; i < hi; i++)
            {
                double d = (times[i] - at[j]) / sigmaYears;
                double w = Math.Exp(-0.5 * d * d);
                sw += w;
                swy += w * values[i];
            }
            result[j] = sw > 0 ? swy / sw : double.NaN;
        }
        return result;
    }

    /// <summary>Band-pass centred on <paramref name="periodYears"/> at <paramref name="at"/>; times ascending.</summary>
    public static double[] BandPass(ReadOnlySpan<double> times, ReadOnlySpan<double> values, double periodYears, double sigmaYears, ReadOnlySpan<double> at)
    {
        Check(times, values, sigmaYears);
        if (!(periodYears > 0)) throw new ArgumentOutOfRangeException(nameof(periodYears), periodYears, "The period must be positive.");
        double mean = 0;
        foreach (double v in values) mean += v;
        mean /= values.Length;
        double w0 = 2 * Math.PI / periodYears;
        var result = new double[at.Length];
        for (int j = 0; j < at.Length; j++)
        {
            var (lo, hi) = Window(times, at[j], sigmaYears);
            double sw = 0, swy = 0;
            for (int i = lo; i < hi; i++)
            {
                double dt = times[i] - at[j];
                double d = dt / sigmaYears;
                double w = Math.Exp(-0.5 * d * d);
                sw += w;
                swy += w * (values[i] - mean) * Math.Cos(w0 * dt);
            }
            result[j] = sw > 0 ? 2 * swy / sw : double.NaN;
        }
        return result;
    }

    private static void Check(ReadOnlySpan<double> times, ReadOnlySpan<double> values, double sigma)
    {
        if (times.Length != values.Length) throw new ArgumentException($"{times.Length} times for {values.Length} values.");
        if (!(sigma > 0)) throw new ArgumentOutOfRangeException(nameof(sigma), sigma, "The kernel width must be positive.");
        for (int i = 1; i < times.Length; i++)
            if (times[i] < times[i - 1]) throw new ArgumentException($"Times must be ascending (sample {i}).", nameof(times));
    }

    /// <summary>Index range [Lo, Hi) of the samples within the kernel's reach of <paramref name="t"/>.</summary>
    private static (int Lo, int Hi) Window(ReadOnlySpan<double> times, double t, double sigma) =>
        (FirstIndex(times, v => v >= t - Reach * sigma), FirstIndex(times, v => v > t + Reach * sigma));

    /// <summary>First index whose value satisfies <paramref name="test"/> (monotone over ascending values), or the length.</summary>
    private static int FirstIndex(ReadOnlySpan<double> sorted, Func<double, bool> test)
    {
        int lo = 0, hi = sorted.Length;
        while (lo < hi)
        {
            int mid = (lo + hi) >>> 1;
            if (test(sorted[mid])) hi = mid; else lo = mid + 1;
        }
        return lo;
    }
}
