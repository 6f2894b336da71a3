using StratLink.Alignment;

namespace StratLink.Tests.Alignment;

/// <summary>
/// The median of the mode holding a value, on draws from normal mixtures whose modality is known: a
/// mixture of two unit normals with equal weights is bimodal exactly when their means are more than
/// 2 sd apart (Robertson and Fryer 1969, from memory), and with unequal weights it needs more. Draws
/// use a fixed seed; the bound on a recovered median is 3 of its standard errors,
/// 1.2533 / sqrt(n) sd for n normal draws (the asymptotic sd of a sample median).
/// </summary>
public class PosteriorModesTests
{
    private static double[] Mixture(int seed, params (int Count, double Mean)[] parts)
    {
        var rng = new Random(seed);
        var v = new List<double>();
        foreach (var (count, mean) in parts)
            for (int k = 0; k < count; k++)
            {
                // Box-Muller.
                double u1 = 1 - rng.NextDouble(), u2 = rng.NextDouble();
                v.Add(mean + Math.Sqrt(-2 * Math.Log(u1)) * Math.Cos(2 * Math.PI * u2));
            }
        v.Sort();
        return [.. v];
    }

    private static double Median(double[] sorted) => Statistics.PercentileSorted(sorted, 50);

    [Theory]
    [InlineData(0.2, 0.0, 140)]
    [InlineData(4.8, 5.0, 260)]
    public void Two_modes_5_sd_apart_give_the_median_of_the_one_holding_the_value(double x, double mode, int count)
    {
        var v = Mixture(3, (140, 0.0), (260, 5.0));
        double got = PosteriorModes.MedianOfModeHolding(v, x);
        Assert.InRange(got, mode - 3 * 1.2533 / Math.Sqrt(count), mode + 3 * 1.2533 / Math.Sqrt(count));
        // The plain median lies in the larger mode, so the low one's differs from it by several sd.
        if (mode == 0) Assert.True(Median(v) - got > 3, $"plain median {Median(v):0.00}, mode's {got:0.00}");
    }

    [Theory]
    [InlineData(1, -2.5)]
    [InlineData(2, 0.0)]
    [InlineData(4, 2.5)]
    public void One_normal_gives_the_plain_median_wherever_the_value_lies(int seed, double x)
    {
        var v = Mixture(seed, (400, 0.0));
        Assert.Equal(Median(v), PosteriorModes.MedianOfModeHolding(v, x));
    }

    [Fact]
    public void Means_1_sd_apart_form_one_mode()
    {
        var v = Mixture(5, (200, 0.0), (200, 1.0));
        Assert.Equal(Median(v), PosteriorModes.MedianOfModeHolding(v, -1));
    }

    [Fact]
    public void A_mode_with_a_tenth_of_the_members_is_merged_into_the_rest()
    {
        var v = Mixture(6, (40, 0.0), (360, 5.0));
        Assert.Equal(Median(v), PosteriorModes.MedianOfModeHolding(v, 0));
    }
}
