using StratLink.Analysis;

namespace StratLink.Tests.Analysis;

public class Ar1Tests
{
    [Fact]
    public void TheoreticalSpectrum_Rho_e_minus_0_2_HasPublishedEndValues()
    {
        // Schulz and Mudelsee 2002 eq. 2 with rho = e^-0.2: G/G0 = (1+rho)/(1-rho) = 10.03 at f = 0 and
        // (1-rho)/(1+rho) = 0.0997 at f_Nyq.
        double rho = Math.Exp(-0.2);
        Assert.Equal(10.03, Ar1Process.RelativeSpectrum(rho, 0, 0.5), 0.005);
        Assert.Equal(0.0997, Ar1Process.RelativeSpectrum(rho, 0.5, 0.5), 0.00005);
    }

    [Fact]
    public void Persistence_RecoversTauOfUnevenAr1()
    {
        // AR(1) with tau = 5 mean spacings on uneven times (gaps 0.2-1.8, seed 21), N = 3000, 3 segments.
        // Expected sd of the estimate (rho = e^-0.2, about 1500 samples a segment): sd(rho) ~ sqrt((1-rho^2)/n) ~ 0.015,
        // i.e. about 8 % of tau; the bound 25 % is three sd.
        var rng = new Random(21);
        int n = 3000;
        var t = new double[n];
        for (int i = 1; i < n; i++) t[i] = t[i - 1] + 0.2 + 1.6 * rng.NextDouble();
        var x = new double[n];
        Ar1Process.Simulate(t, 5.0, rng, x);
        var est = Persistence.Estimate(t, x, 3);
        Assert.InRange(est.TauYears, 5.0 * 0.75, 5.0 * 1.25);
    }

    [Fact]
    public void Simulate_HasUnitVarianceAndTheRightLagOneCorrelation()
    {
        // Even spacing 1, tau = 5: lag-one autocorrelation e^-0.2 = 0.819 (sd ~ 0.006 at N = 20000: bound 0.02),
        // variance 1 (sd of the sample variance ~ 0.03 for this persistence: bound 0.1).
        var t = Enumerable.Range(0, 20000).Select(i => (double)i).ToArray();
        var x = new double[t.Length];
        Ar1Process.Simulate(t, 5, new Random(5), x);
        double m = x.Average();
        double v = x.Sum(a => (a - m) * (a - m)) / (x.Length - 1);
        double c = 0;
        for (int i = 1; i < x.Length; i++) c += (x[i] - m) * (x[i - 1] - m);
        c /= (x.Length - 1) * v;
        Assert.Equal(1.0, v, 0.1);
        Assert.Equal(Math.Exp(-0.2), c, 0.02);
    }
}
