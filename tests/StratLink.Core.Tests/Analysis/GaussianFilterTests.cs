using StratLink.Analysis;

namespace StratLink.Tests.Analysis;

public class GaussianFilterTests
{
    private static readonly double[] Times = Enumerable.Range(0, 6001).Select(i => (double)i).ToArray();

    /// <summary>Amplitude of the filtered cosine over the middle third (far from the ends).</summary>
    private static double Amplitude(double[] filtered)
    {
        int lo = filtered.Length / 3, hi = 2 * filtered.Length / 3;
        double max = 0;
        for (int i = lo; i < hi; i++) max = Math.Max(max, Math.Abs(filtered[i]));
        return max;
    }

    [Fact]
    public void Constants_0_1874_IsHalfAmplitude_0_1325_IsHalfPower()
    {
        // Source: the Gaussian kernel's Fourier transform (standard result; Rehfeld et al. 2011 use the kernel).
        // Gaussian low-pass gain exp(-2 pi^2 sigma^2 f^2) (the kernel's Fourier transform) equals 1/2 at
        // f = 0.1874/sigma (the value methods tables quote as "half power") and 1/sqrt 2, i.e. half the power,
        // at f = sqrt(ln 2 / 4 pi^2)/sigma = 0.1325/sigma.
        Assert.Equal(0.1874, GaussianFilter.HalfAmplitudeConstant, 5e-5);
        Assert.Equal(0.5, GaussianFilter.Gain(20, GaussianFilter.HalfAmplitudeFrequency(20)), 1e-12);
        Assert.Equal(0.1325, GaussianFilter.HalfPowerConstant, 5e-5);
        Assert.Equal(Math.Sqrt(0.5), GaussianFilter.Gain(20, GaussianFilter.HalfPowerFrequency(20)), 1e-12);
    }

    [Fact]
    public void LowPass_GainHalfAt0_1874OverSigma_HalfPowerAt0_1325OverSigma()
    {
        // Dense even sampling (step 1 << sigma = 20), so the discrete filter follows the continuous gain;
        // tolerance 0.002 (the sampled peak misses the true crest by at most (pi f)^2/2 ~ 4e-4).
        double sigma = 20;
        double fa = GaussianFilter.HalfAmplitudeFrequency(sigma);
        var ya = Times.Select(t => Math.Cos(2 * Math.PI * fa * t)).ToArray();
        Assert.Equal(0.5, Amplitude(GaussianFilter.LowPass(Times, ya, sigma, Times)), 0.002);
        double f = GaussianFilter.HalfPowerFrequency(sigma);
        var y = Times.Select(t => Math.Cos(2 * Math.PI * f * t)).ToArray();
        var lp = GaussianFilter.LowPass(Times, y, sigma, Times);
        Assert.Equal(Math.Sqrt(0.5), Amplitude(lp), 0.002);
        // And at another frequency the gain is exp(-2 pi^2 sigma^2 f^2).
        double f2 = 0.004;
        var y2 = Times.Select(t => Math.Cos(2 * Math.PI * f2 * t)).ToArray();
        Assert.Equal(GaussianFilter.Gain(sigma, f2), Amplitude(GaussianFilter.LowPass(Times, y2, sigma, Times)), 0.002);
    }

    [Fact]
    public void BandPass_UnitGainAtCentre_HalfPowerAtHalfPowerHalfWidth()
    {
        // Band-pass gain G(f - f0) + G(f + f0): 1 at f0 (the image term G(2 f0) is ~1e-16 here) and 1/sqrt 2 at
        // f0 + 0.1325/sigma. Period 88 yr, sigma 60 yr.
        double period = 88, sigma = 60, f0 = 1 / period;
        var y = Times.Select(t => Math.Cos(2 * Math.PI * f0 * t)).ToArray();
        Assert.Equal(1.0, Amplitude(GaussianFilter.BandPass(Times, y, period, sigma, Times)), 0.002);
        double fh = f0 + GaussianFilter.HalfPowerFrequency(sigma);
        var yh = Times.Select(t => Math.Cos(2 * Math.PI * fh * t)).ToArray();
        Assert.Equal(Math.Sqrt(0.5), Amplitude(GaussianFilter.BandPass(Times, yh, period, sigma, Times)), 0.002);
    }
}
