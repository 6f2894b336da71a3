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

    [Fact]
    public void Selection_of_long_ranges_equals_sorting()
    {
        // Past 600 values the selection first settles a sample around the rank (Floyd and Rivest 1975); whatever
        // the path, every selected value must be the order statistic a full sort puts there.
        var rng = new Random(11);
        for (int trial = 0; trial < 120; trial++)
        {
            int n = 601 + rng.Next(4400);
            var values = (trial % 4) switch
            {
                0 => Enumerable.Range(0, n).Select(_ => (double)rng.Next(7)).ToArray(),
                1 => Enumerable.Range(0, n).Select(k => (double)k).ToArray(),
                2 => Enumerable.Range(0, n).Select(k => (double)(n - k)).ToArray(),
                _ => Enumerable.Range(0, n).Select(_ => rng.NextDouble() * 1e4 - 5e3).ToArray(),
            };
            var sorted = values.Order().ToArray();
            int lo = (int)((n - 1) * 0.025), mid = (n - 1) / 2, hi = (int)((n - 1) * 0.975);
            int[] ranks = [lo, lo + 1, mid, mid + 1, hi, hi + 1];
            var selected = (double[])values.Clone();
            OrderStatistics.SelectRanks(selected, ranks);
            foreach (int r in ranks) Assert.Equal(sorted[r], selected[r]);
            foreach (double p in new[] { 2.5, 50, 97.5 })
                Assert.Equal(Statistics.PercentileSorted(sorted, p), OrderStatistics.PercentileInPlace((double[])values.Clone(), p));
        }
    }
}
