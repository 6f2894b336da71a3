using MathNet.Numerics.Distributions;
using StratLink.Checks;

namespace StratLink.Tests.Checks;

public class FamilyWiseLimitTests
{
    [Fact]
    public void OneComparisonKeepsItsOwnLimit()
    {
        Assert.Equal(3.0, FamilyWiseLimit.Sigmas(3.0, 1), 12);
        Assert.Equal(3.0, FamilyWiseLimit.Sigmas(3.0, 0.5), 12);
    }

    [Fact]
    public void SidakLimitForTenComparisonsAtFivePercent()
    {
        // Šidák (1967); worked value from memory: a 5 % family of 10 comparisons allows each
        // 1 - 0.95^(1/10) = 0.005116, two-sided z = 2.7995 (standard normal table). Tolerance 0.001.
        Assert.Equal(2.7995, FamilyWiseLimit.Sigmas(1.959964, 10), 0.001);
    }

    [Fact]
    public void TheWorstOfManyIndependentMisfitsExceedsTheRaisedLimitAsOftenAsOneExceedsThree()
    {
        // 100,000 families of 20 standard normal misfits (seed 11): the worst passes the raised limit
        // with the rate of one comparison at 3 sigma, 0.270 %, i.e. 270 families; the binomial sd is
        // 16.4, so 4 sd is 66. At 3 sigma unraised, 1 - (1 - 0.0027)^20 = 5.3 % of families would.
        var rng = new Random(11);
        double limit = FamilyWiseLimit.Sigmas(3, 20);
        int raised = 0, plain = 0;
        for (int f = 0; f < 100_000; f++)
        {
            double worst = 0;
            for (int i = 0; i < 20; i++) worst = Math.Max(worst, Math.Abs(Normal.Sample(rng, 0, 1)));
            if (worst > limit) raised++;
            if (worst > 3) plain++;
        }
        Assert.InRange(raised, 270 - 66, 270 + 66);
        Assert.InRange(plain, 5300 - 300, 5300 + 300);
    }

    [Fact]
    public void WhiteNoiseIsAsManyValuesAsItHas()
    {
        // Independent values: every autocorrelation is sampling noise (sd 1/sqrt(n) = 0.032), so the
        // effective number stays near n; 0.8 n allows the first lags to add a few sd.
        var rng = new Random(5);
        var x = Enumerable.Range(0, 1000).Select(_ => Normal.Sample(rng, 0, 1)).ToArray();
        Assert.InRange(FamilyWiseLimit.EffectiveCount(x), 800, 1000);
    }

    [Theory]
    [InlineData(0.5)]
    [InlineData(0.9)]
    public void AFirstOrderAutoregressiveSeriesHasTheTextbookEffectiveNumber(double phi)
    {
        // AR(1) with coefficient phi: r_k = phi^k, so n / (1 + 2 sum (1 - k/n) phi^k) -> n (1 - phi) / (1 + phi)
        // for long series (Bretherton et al. 1999, from memory). 20,000 values (seed 3). The truncated
        // sum is itself noisy: over 20 seeded series it gave 0.88-1.02 (phi 0.5) and 0.75-1.12 (phi 0.9)
        // of the expected number (measured), so the tolerance is -30 % / +20 %.
        var rng = new Random(3);
        int n = 20_000;
        var x = new double[n];
        for (int i = 1; i < n; i++) x[i] = phi * x[i - 1] + Normal.Sample(rng, 0, 1);
        double expected = n * (1 - phi) / (1 + phi);
        Assert.InRange(FamilyWiseLimit.EffectiveCount(x), 0.7 * expected, 1.2 * expected);
    }

    [Fact]
    public void ASmoothDepartureIsOneValueAndAConstantToo()
    {
        // One bump over the whole series: everything moves together.
        var bump = Enumerable.Range(0, 200).Select(i => Math.Sin(Math.PI * i / 199)).ToArray();
        Assert.InRange(FamilyWiseLimit.EffectiveCount(bump), 1, 10);
        Assert.Equal(1, FamilyWiseLimit.EffectiveCount(Enumerable.Repeat(2.5, 50).ToArray()));
        Assert.Equal(0, FamilyWiseLimit.EffectiveCount([]));
    }
}
