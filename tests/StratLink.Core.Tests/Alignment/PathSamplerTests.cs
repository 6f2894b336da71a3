using System.Numerics;
using StratLink.Alignment;

namespace StratLink.Tests.Alignment;

/// <summary>
/// The path sampler against the definition of its posterior, P(path) ~ exp(-C(path) / T), on lattices
/// small enough to enumerate every path: sampled frequencies must match within 5 binomial SDs.
/// </summary>
public class PathSamplerTests
{
    private static readonly double[] A = [0.1, 0.9, 1.7, 1.2, 0.4];
    private static readonly double[] B = [0.0, 0.5, 1.5, 1.9, 1.0, 0.3];

    /// <summary>Every path ending at (i, j) with its cost, following the pattern's productions backwards.</summary>
    private static IEnumerable<(List<(int, int)> Cells, double Cost)> Paths(StepPattern pattern, AbsoluteCost cost, int i, int j, bool openBegin)
    {
        if (i == 0 && j == 0 && !openBegin) { yield return ([(0, 0)], cost.Cost(0, 0)); yield break; }
        foreach (var prod in pattern.Productions)
        {
            int oi = i - prod.OriginI, oj = j - prod.OriginJ;
            if (oj < 0 || oi < -1 || (oi == -1 && !openBegin)) continue;
            double c = 0;
            var mid = new List<(int, int)>();
            foreach (var st in prod.Cells)
            {
                int ci = i - st.BackI, cj = j - st.BackJ;
                if (ci < 0) continue;
                c += st.Weight * cost.Cost(ci, cj);
                if (st.BackI != 0 || st.BackJ != 0) mid.Add((ci, cj));
            }
            if (oi == -1) { yield return ([.. mid, (i, j)], c); continue; }
            foreach (var (cells, pc) in Paths(pattern, cost, oi, oj, openBegin))
                yield return ([.. cells, .. mid, (i, j)], pc + c);
        }
    }

    [Theory]
    [InlineData("symmetric2", false, false, 0.8)]
    [InlineData("symmetric1", false, false, 0.5)]
    [InlineData("asymmetric", true, true, 0.6)]
    [InlineData("symmetricP1", false, false, 1.0)]
    public void Sampled_paths_follow_the_enumerated_posterior(string patternName, bool openBegin, bool openEnd, double temperature)
    {
        var pattern = StepPattern.Parse(patternName);
        var cost = new AbsoluteCost(A, B);
        int n = A.Length, m = B.Length;
        var ends = openEnd ? Enumerable.Range(0, m) : [m - 1];
        var all = ends.SelectMany(j => Paths(pattern, cost, n - 1, j, openBegin)).ToList();
        double min = all.Min(p => p.Cost);
        var weights = all.Select(p => Math.Exp(-(p.Cost - min) / temperature)).ToArray();
        double total = weights.Sum();
        var exact = new Dictionary<string, double>();
        for (int k = 0; k < all.Count; k++)
        {
            string key = string.Join(";", all[k].Cells);
            exact[key] = exact.GetValueOrDefault(key) + weights[k] / total;
        }

        var options = new DtwOptions { OpenBegin = openBegin, OpenEnd = openEnd };
        var sampler = new PathSampler<AbsoluteCost>(cost, pattern, Band.Full(n, m), options, temperature, null, 0, default);
        var rng = new Random(3);
        const int draws = 20000;
        var counts = new Dictionary<string, int>();
        for (int d = 0; d < draws; d++)
        {
            var (pi, pj) = sampler.Sample(rng);
            string key = string.Join(";", pi.Zip(pj));
            Assert.True(exact.ContainsKey(key), $"sampled a path that is not allowed: {key}");
            counts[key] = counts.GetValueOrDefault(key) + 1;
        }
        foreach (var (key, p) in exact.OrderByDescending(e => e.Value).Take(5))
        {
            double sd = Math.Sqrt(draws * p * (1 - p));
            Assert.True(Math.Abs(counts.GetValueOrDefault(key) - draws * p) <= 5 * sd + 1, $"path {key}: drawn {counts.GetValueOrDefault(key)}, expected {draws * p:0.0}");
        }
    }

    /// <summary>Delannoy number D(a, b), the count of symmetric2 paths from (0, 0) to (a, b): sum_k C(a, k) C(b, k) 2^k (Banderier and Schwer 2005, "Why Delannoy numbers?").</summary>
    private static BigInteger Delannoy(int a, int b)
    {
        BigInteger sum = 0, ca = 1, cb = 1, two = 1;
        for (int k = 0; k <= Math.Min(a, b); k++)
        {
            sum += ca * cb * two;
            ca = ca * (a - k) / (k + 1);
            cb = cb * (b - k) / (k + 1);
            two *= 2;
        }
        return sum;
    }

    /// <summary>
    /// Where every cell costs alike, each path weighs the same under symmetric2 (its weight is i + j
    /// whatever its steps), so the posterior is uniform over lattice paths and the share passing a
    /// cell is a ratio of path counts. Between two ties 77 grid steps apart this is the pull towards
    /// the straight line that every sampled ensemble carries: a crossing 10 cells off the diagonal
    /// at the middle has e^-1.84 the paths of one on it.
    /// </summary>
    [Fact]
    public void Equal_costs_give_every_lattice_path_the_same_weight()
    {
        const int size = 78, row = 38;
        var flat = new double[size];
        var sampler = new PathSampler<AbsoluteCost>(new AbsoluteCost(flat, flat), StepPattern.Symmetric2, Band.Full(size, size), new DtwOptions(), 0.5, null, 0, default);
        var rng = new Random(5);
        const int draws = 20000;
        var through = new int[size];
        for (int d = 0; d < draws; d++)
        {
            var (pi, pj) = sampler.Sample(rng);
            for (int k = 0; k < pi.Length; k++) if (pi[k] == row) through[pj[k]]++;
        }
        var total = Delannoy(size - 1, size - 1);
        double Share(int j) => Math.Exp(BigInteger.Log(Delannoy(row, j) * Delannoy(size - 1 - row, size - 1 - j)) - BigInteger.Log(total));
        Assert.Equal(-1.84, Math.Log(Share(row + 10) / Share(row)), 2);
        foreach (int j in new[] { row - 10, row, row + 5, row + 10 })
        {
            double p = Share(j), sd = Math.Sqrt(draws * p * (1 - p));
            Assert.True(Math.Abs(through[j] - draws * p) <= 5 * sd, $"cell ({row}, {j}): passed {through[j]} times, expected {draws * p:0.0}");
        }
    }
}
