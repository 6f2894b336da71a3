using StratLink.Alignment;
using StratLink.Compositing;
using StratLink.Quantities;

namespace StratLink.Tests.Compositing;

public class PiecewiseLinearSweepTests
{
    [Fact]
    public void Worked_example_interpolates_and_extends_with_the_end_slopes()
    {
        // Knots (0,10) (10,30) (20,30) (30,40): slopes 2, 0, 1. Values worked by hand from the
        // definition of linear interpolation; beyond the ends the end segments continue.
        double[] xs = [0, 10, 20, 30], ys = [10, 30, 30, 40];
        double[] at = [-5, 0, 5, 10, 15, 25, 30, 35];
        var got = new double[at.Length];
        PiecewiseLinearSweep.EvaluateAscending(xs, ys, at, got);
        Assert.Equal([0, 10, 20, 30, 30, 35, 40, 45], got);
    }

    [Fact]
    public void Sweep_matches_the_mappings_own_evaluation_exactly_with_flat_and_vertical_segments()
    {
        // Random monotone mappings with repeated knots in either scale (hiatus in one core or the other).
        var rng = new Random(20240611);
        for (int trial = 0; trial < 200; trial++)
        {
            int n = 1 + rng.Next(12);
            double[] core = new double[n], comp = new double[n];
            for (int i = 0; i < n; i++)
            {
                core[i] = (i == 0 ? rng.NextDouble() * 10 : core[i - 1]) + (rng.Next(4) == 0 ? 0 : rng.NextDouble() * 5);
                comp[i] = (i == 0 ? rng.NextDouble() * 10 : comp[i - 1]) + (rng.Next(4) == 0 ? 0 : rng.NextDouble() * 5);
            }
            var mapping = new DepthMapping("X", DepthUnit.Centimetre, core, comp);
            double[] at = [.. Enumerable.Range(0, 300).Select(_ => -20 + rng.NextDouble() * 100).Concat(core).Concat(comp).Order()];
            var forward = new double[at.Length];
            var inverse = new double[at.Length];
            PiecewiseLinearSweep.EvaluateAscending(core, comp, at, forward);
            PiecewiseLinearSweep.EvaluateAscending(comp, core, at, inverse);
            for (int k = 0; k < at.Length; k++)
            {
                Assert.Equal(mapping.ToCompositeValue(at[k]), forward[k]);
                Assert.Equal(mapping.ToCoreValue(at[k]), inverse[k]);
            }
        }
    }
}
