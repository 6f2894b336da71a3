using StratLink.Compositing;

namespace StratLink.Tests.Compositing;

public class OrderStatisticsTests
{
    [Fact]
    public void Percentiles_of_one_to_ten_match_R_quantile_type_7()
    {
        // Source: R's quantile(1:10, c(0.025, 0.5, 0.975), type = 7) gives 1.225, 5.5, 9.775
        // (Hyndman and Fan 1996 definition 7: h = (n-1)p, linear between order statistics).
        double[] shuffled = [7, 3, 10, 1, 9, 2, 8, 5, 4, 6];
        Assert.Equal(1.225, OrderStatistics.PercentileInPlace((double[])shuffled.Clone(), 2.5), 12);
        Assert.Equal(5.5, OrderStatistics.PercentileInPlace((double[])shuffled.Clone(), 50), 12);
        Assert.Equal(9.775, OrderStatistics.PercentileInPlace((double[])shuffled.Clone(), 97.5), 12);
    }

    [Fact]
    public void Selection_equals_sorting_with_ties_and_any_length()
    {
        var rng = new Random(7);
        for (int trial = 0; trial < 500; trial++)
        {
            int n = 1 + rng.Next(400);
            // Few distinct values half the time: ties are the hard case for selection.
            var values = Enumerable.Range(0, n).Select(_ => trial % 2 == 0 ? rng.Next(5) : rng.NextDouble()).ToArray();
            var sorted = values.Order().ToArray();
            foreach (double p in new[] { 0, 2.5, 50, 97.5, 100 })
                Assert.Equal(Statistics.PercentileSorted(sorted, p), OrderStatistics.PercentileInPlace((double[])values.Clone(), p));
        }
    }
}
