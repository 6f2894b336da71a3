namespace StratLink.Analysis;

/// <summary>
/// Persistence time of an unevenly spaced record (Mudelsee 2002, C&amp;G 28:69): on each half-overlapping
/// segment, detrended and standardised, minimise S [x_i - a^(dt_i/dbar) x_(i-1)]^2 for a in (0, 1), correct the
/// bias of a (Kendall 1954: rho = (a (n - 1) + 1) / (n - 4)), average over segments (Schulz and Mudelsee
/// 2002) and convert with tau = -dbar / ln rho.
/// </summary>
public static class Persistence
{
    /// <summary>Upper bound kept for rho so tau stays finite.</summary>
    public const double MaximumRho = 0.999;

    public static PersistenceEstimate Estimate(ReadOnlySpan<double> timesForward, ReadOnlySpan<double> values, int segments)
    {
        int n = timesForward.Length;
        var layout = SegmentLayout.Of(n, segments);
        double meanSpacing = (timesForward[n - 1] - timesForward[0]) / (n - 1);
        int m = layout.Length;
        var u = new double[m];
        var x = new double[m];
        double rhoSum = 0;
        foreach (int start in layout.Starts)
        {
            timesForward.Slice(start, m).CopyTo(u);
            values.Slice(start, m).CopyTo(x);
            SegmentLayout.Detrend(u, x);
            double sd = Math.Sqrt(SumSquares(x) / (m - 1));
            double dbar = (u[m - 1] - u[0]) / (m - 1);
            for (int i = 0; i < m; i++)
            {
                x[i] = sd > 0 ? x[i] / sd : 0;
                u[i] /= dbar;
            }
            double a = MinimiseLeastSquares(u, x);
            rhoSum += (a * (m - 1) + 1) / (m - 4);
        }
        double rho = rhoSum / layout.Starts.Length;
        bool clamped = false;
        if (rho <= 0) return new PersistenceEstimate(0, 0, meanSpacing, false);
        if (rho > MaximumRho) { rho = MaximumRho; clamped = true; }
        return new PersistenceEstimate(-meanSpacing / Math.Log(rho), rho, meanSpacing, clamped);
    }

    /// <summary>A coarse scan over (0, 1) finds the global minimum's neighbourhood (the function can have several minima), a golden-section search refines it.</summary>
    private static double MinimiseLeastSquares(double[] u, double[] x)
    {
        double Ls(double a)
        {
            double s = 0;
            for (int i = 1; i < u.Length; i++)
            {
                double r = x[i] - Math.Pow(a, u[i] - u[i - 1]) * x[i - 1];
                s += r * r;
            }
            return s;
        }
        const int steps = 100;
        double best = 0.5 / steps, bestValue = double.PositiveInfinity;
        for (int j = 0; j < steps; j++)
        {
            double a = (j + 0.5) / steps;
            double v = Ls(a);
            if (v < bestValue) { bestValue = v; best = a; }
        }
        return GoldenSection(Ls, Math.Max(0, best - 1.0 / steps), Math.Min(1, best + 1.0 / steps));
    }

    /// <summary>Golden-section search for the minimum inside [lo, hi] (never leaves the interval, unlike searches that expand their bracket).</summary>
    private static double GoldenSection(Func<double, double> f, double lo, double hi)
    {
        double g = (Math.Sqrt(5) - 1) / 2;
        double a = hi - g * (hi - lo), b = lo + g * (hi - lo);
        double fa = f(a), fb = f(b);
        while (hi - lo > 1e-10)
        {
            if (fa < fb) { hi = b; b = a; fb = fa; a = hi - g * (hi - lo); fa = f(a); }
            else { lo = a; a = b; fa = fb; b = lo + g * (hi - lo); fb = f(b); }
        }
        return 0.5 * (lo + hi);
    }

    private static double SumSquares(double[] x)
    {
        double s = 0;
        foreach (double v in x) s += v * v;
        return s;
    }
}
