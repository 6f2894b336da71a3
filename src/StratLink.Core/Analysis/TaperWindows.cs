namespace StratLink.Analysis;

/// <summary>Shapes and derived properties of the <see cref="TaperWindow"/>s, computed from the shapes themselves.</summary>
public static class TaperWindows
{
    private const int QuadraturePoints = 20000;

    /// <summary>Weight at relative position <paramref name="x"/> in [0, 1] along the segment.</summary>
    public static double Weight(this TaperWindow window, double x) => window switch
    {
        TaperWindow.Rectangular => 1.0,
        TaperWindow.Welch => 1 - (2 * x - 1) * (2 * x - 1),
        TaperWindow.Hann => Math.Sin(Math.PI * x) * Math.Sin(Math.PI * x),
        TaperWindow.Triangular => 1 - Math.Abs(2 * x - 1),
        _ => throw new ArgumentOutOfRangeException(nameof(window)),
    };

    /// <summary>
    /// Correlation of two segments overlapping by half: c = S w(x) w(x + 1/2) / S w(x)^2 (Harris 1978,
    /// "overlap correlation"; rectangle 0.5, triangle 0.25, Hann 1/6).
    /// </summary>
    public static double HalfOverlapCorrelation(this TaperWindow window)
    {
        double num = 0, den = 0;
        for (int i = 0; i < QuadraturePoints; i++)
        {
            double x = (i + 0.5) / QuadraturePoints;
            double w = window.Weight(x);
            den += w * w;
            if (x >= 0.5) num += w * window.Weight(x - 0.5);
        }
        return num / den;
    }

    /// <summary>
    /// Equivalent degrees of freedom of an average of <paramref name="segments"/> tapered spectra overlapping
    /// by half: 2n / (1 + 2c^2 - 2c^2/n) (Welch 1967, IEEE Trans. Audio Electroacoust. 15:70; Percival and
    /// Walden 1993, eq. 292b, with only neighbouring segments overlapping).
    /// </summary>
    public static double EquivalentDegreesOfFreedom(this TaperWindow window, int segments)
    {
        double c = window.HalfOverlapCorrelation();
        double c2 = 2 * c * c;
        return 2.0 * segments / (1 + c2 - c2 / segments);
    }

    /// <summary>
    /// Full width of the window's main lobe where its amplitude response has fallen by 6 dB (to one half), in
    /// frequency bins (1 bin = 1 / segment duration); Harris 1978 Table 1 lists 1.21 for the rectangle and
    /// 2.00 for Hann.
    /// </summary>
    public static double SixDecibelBandwidthBins(this TaperWindow window)
    {
        double a0 = Amplitude(window, 0);
        double lo = 0, hi = 3;
        for (int it = 0; it < 60; it++)
        {
            double mid = 0.5 * (lo + hi);
            if (Amplitude(window, mid) / a0 > 0.5) lo = mid; else hi = mid;
        }
        return lo + hi;
    }

    /// <summary>|S w(x) e^(-2 pi i nu x) dx| at <paramref name="bins"/> cycles per segment.</summary>
    private static double Amplitude(TaperWindow window, double bins)
    {
        const int m = 4000;
        double re = 0, im = 0;
        for (int i = 0; i < m; i++)
        {
            double x = (i + 0.5) / m;
            double w = window.Weight(x);
            re += w * Math.Cos(2 * Math.PI * bins * x);
            im -= w * Math.Sin(2 * Math.PI * bins * x);
        }
        return Math.Sqrt(re * re + im * im) / m;
    }
}
