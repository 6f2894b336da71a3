using StratLink.Analysis;

namespace StratLink.Tests.Analysis;

public class RedNoiseSpectrumTests
{
    [Fact]
    public void CyclesOf11And88Years_StandAboveThe95PercentLevel()
    {
        // Invented record: 600 uneven ages over 1500-0 cal BP (seed 8), cosines of 11 and 88 yr (amplitude 0.7)
        // in unit AR(1) noise with tau = 8 yr. Each cycle carries 0.245 of variance in a band of one resolution
        // width: far above any 95 % level of the noise, so both must exceed it (Monte Carlo, 1000 surrogates).
        var rng = new Random(8);
        var ages = SyntheticRecords.UnevenAges(rng, 600, 1500);
        var y = SyntheticRecords.CyclesPlusRedNoise(rng, ages, 8, (0.7, 11), (0.7, 88));
        var s = RedNoiseSpectrum.Estimate(AgeSeries.Create(ages, y), new SpectrumOptions(), seed: 1);
        Assert.True(SyntheticRecords.PeakRatio(s, 11, 95) > 1, $"11 yr: {SyntheticRecords.PeakRatio(s, 11, 95):F2}");
        Assert.True(SyntheticRecords.PeakRatio(s, 88, 95) > 1, $"88 yr: {SyntheticRecords.PeakRatio(s, 88, 95):F2}");
        // The persistence of the noise is found despite the cycles: tau within a factor 2 of 8 yr (the cycles add
        // persistence of their own, so only the order of magnitude is checked).
        Assert.InRange(s.Persistence.TauYears, 4, 16);
        Assert.Equal(1000, s.Surrogates);
    }

    [Fact]
    public void PureRedNoise_ExceedsThe95PercentLevelAtAboutFivePercentOfFrequencies()
    {
        // Calibration: 8 AR(1) records (tau 20 yr, 400 uneven ages over 2000 yr, seeds 100-107) without any cycle.
        // By construction about 5 % of frequencies exceed the 95 % Monte Carlo level. The estimate of tau is
        // itself noisy and neighbouring frequencies are correlated (4-fold oversampling), so the pooled share is
        // only required to lie in [2 %, 10 %].
        double above = 0, total = 0;
        for (int r = 0; r < 8; r++)
        {
            var rng = new Random(100 + r);
            var ages = SyntheticRecords.UnevenAges(rng, 400, 2000);
            var y = SyntheticRecords.CyclesPlusRedNoise(rng, ages, 20);
            var s = RedNoiseSpectrum.Estimate(AgeSeries.Create(ages, y), new SpectrumOptions { Surrogates = 300 }, seed: r);
            var level = s.Level(95);
            for (int k = 0; k < level.Length; k++) { total++; if (s.Power[k] > level[k]) above++; }
        }
        Assert.InRange(above / total, 0.02, 0.10);
    }

    [Fact]
    public void SameSeed_SameSpectrum_BitForBit()
    {
        // Surrogate batches run in parallel, each with its own seeded stream: the result must not depend on scheduling.
        var rng = new Random(9);
        var ages = SyntheticRecords.UnevenAges(rng, 300, 900);
        var y = SyntheticRecords.CyclesPlusRedNoise(rng, ages, 5, (0.5, 30));
        var series = AgeSeries.Create(ages, y);
        var a = RedNoiseSpectrum.Estimate(series, new SpectrumOptions { Surrogates = 200 }, seed: 42);
        var b = RedNoiseSpectrum.Estimate(series, new SpectrumOptions { Surrogates = 200 }, seed: 42);
        Assert.Equal(a.Level(95), b.Level(95));
        Assert.Equal(a.Power, b.Power);
        var c = RedNoiseSpectrum.Estimate(series, new SpectrumOptions { Surrogates = 200 }, seed: 43);
        Assert.NotEqual(a.Level(95), c.Level(95));
    }

    [Fact]
    public void WhiteNoiseSpectrum_AreaEqualsVariance()
    {
        // Scaling: white noise of variance 4 has level 2 dbar s^2 and area s^2 up to the mean Nyquist frequency
        // (one-sided Parseval). Averaged over 3 segments x 600 frequencies the area has a few % scatter: +-10 %.
        var rng = new Random(12);
        var ages = SyntheticRecords.UnevenAges(rng, 800, 4000);
        var y = new double[ages.Length];
        MathNet.Numerics.Distributions.Normal.Samples(rng, y, 0, 2);
        var s = RedNoiseSpectrum.Estimate(AgeSeries.Create(ages, y), new SpectrumOptions { Surrogates = 0, Taper = TaperWindow.Rectangular }, 1);
        double area = s.RawPower.Sum() * s.Grid.Step;
        Assert.Equal(4.0, area, 0.4);
    }
}
