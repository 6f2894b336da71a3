using MathNet.Numerics.Distributions;

namespace StratLink.Analysis;

/// <summary>
/// Gaussian AR(1) (red noise) on uneven times: x_i = e^(-dt_i/tau) x_(i-1) + e_i, Var e_i = 1 - e^(-2 dt_i/tau),
/// unit variance (Schulz and Mudelsee 2002, C&amp;G 28:421; Robinson 1977).
/// </summary>
public static class Ar1Process
{
    /// <summary>
    /// Fills <paramref name="output"/> with one realisation on <paramref name="timesForward"/> (non-decreasing);
    /// tau = 0 gives white noise.
    /// </summary>
    public static void Simulate(ReadOnlySpan<double> timesForward, double tauYears, Random random, Span<double> output)
    {
        var z = new double[timesForward.Length];
        Normal.Samples(random, z, 0, 1);
        output[0] = z[0];
        for (int i = 1; i < timesForward.Length; i++)
        {
            if (tauYears <= 0) { output[i] = z[i]; continue; }
            double a = Math.Exp(-(timesForward[i] - timesForward[i - 1]) / tauYears);
            output[i] = a * output[i - 1] + Math.Sqrt(1 - a * a) * z[i];
        }
    }

    /// <summary>
    /// Theoretical AR(1) spectrum relative to its average level: G/G0 = (1 - rho^2) / (1 - 2 rho cos(pi f/f_Nyq) + rho^2)
    /// (Schulz and Mudelsee 2002, eq. 2; Mann and Lees 1996, eq. 4), rho the lag-one autocorrelation at the mean spacing.
    /// </summary>
    public static double RelativeSpectrum(double rho, double frequency, double nyquistFrequency) =>
        (1 - rho * rho) / (1 - 2 * rho * Math.Cos(Math.PI * frequency / nyquistFrequency) + rho * rho);
}
