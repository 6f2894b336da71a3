using StratLink.Alignment;
using StratLink.Quantities;

namespace StratLink.Tests.Alignment;

/// <summary>
/// The composite scale past the reference's base on a worked example (values by hand from the
/// method's definition): the reference holds 0-100 cm; the carrier C (0-300 cm) maps at ratio 1;
/// the other core K (0-250 cm) maps at ratio 0.5 inside the reference and, matched to C, at 0.6
/// past it, so its long-run line (0.5 x) puts each level it shares with C higher than C's does.
/// </summary>
public class ScaleContinuationTests
{
    private const DepthUnit Cm = DepthUnit.Centimetre;

    private static PreparedSignals Core(string id, int count) => new(id, 0, 1, count, ["ms"], new double[count]);

    private static DepthMapping Map(string id, params (double X, double Y)[] knots) =>
        new(id, Cm, [.. knots.Select(k => k.X)], [.. knots.Select(k => k.Y)]);

    private static (PreparedSignals C, PreparedSignals K, DepthMapping Carrier, DepthMapping Other) Site() =>
        (Core("C", 301), Core("K", 251), Map("C", (0, 0), (300, 300)), Map("K", (0, 0), (200, 100), (250, 130)));

    [Fact]
    public void The_carrier_past_the_base_follows_the_cores_mean_long_run_line_at_the_levels_they_share()
    {
        var (c, k, carrier, other) = Site();
        var result = ScaleContinuation.Consensus(new MappingEnsemble(carrier, []), c, [(c, carrier), (k, other)], 0, 100, below: true, Cm).Median;
        // Tolerance: arithmetic only. Inside the reference nothing moves.
        Assert.Equal(50, result.ToCompositeValue(50), 1e-9);
        Assert.Equal(100, result.ToCompositeValue(100), 1e-9);
        // At C's 120 cm (composite 120) K's median puts 200 + 20 / 0.6 cm of K, whose line gives
        // 116.67: the mean of the offsets (0 for C, -3.33 for K, equal shared lengths) is -1.67.
        Assert.Equal(120 - 10.0 / 6, result.ToCompositeValue(120), 1e-9);
        // Past K's base (composite 130, K's line 125 there) K's offset -5 is held.
        Assert.Equal(200 - 2.5, result.ToCompositeValue(200), 1e-9);
    }

    [Fact]
    public void The_scale_past_the_base_is_uncertain_by_how_far_the_cores_lines_scatter()
    {
        var (c, k, carrier, other) = Site();
        var members = Enumerable.Repeat(carrier, 2000).ToArray();
        var result = ScaleContinuation.Consensus(new MappingEnsemble(carrier, members), c, [(c, carrier), (k, other)], 0, 100, below: true, Cm, seed: 11);
        // At 120 cm the offsets are 0 (C) and -3.33 (K) about their mean -1.67: sample sd 2.357, times
        // sqrt(1 + 1/2) for a new record, 2.887. Tolerance 5 %: three standard errors of a standard
        // deviation from 2000 normal draws (relative 1 / sqrt(2 x 2000) = 1.6 %), fixed seed.
        var at120 = result.Members.Select(m => m.ToCompositeValue(120)).ToArray();
        double mean = at120.Average(), sd = Math.Sqrt(at120.Sum(v => (v - mean) * (v - mean)) / (at120.Length - 1));
        Assert.Equal(Math.Sqrt(50.0 / 6), sd, 0.05 * Math.Sqrt(50.0 / 6));
        Assert.Equal(120 - 10.0 / 6, mean, 0.2); // 3 standard errors of the mean (2.887 / sqrt 2000 = 0.065)
        // Inside the reference no member moves.
        Assert.All(result.Members, m => Assert.Equal(50, m.ToCompositeValue(50), 1e-9));
    }

    [Fact]
    public void Member_e_of_every_core_is_moved_as_member_e_of_the_carrier_moves_the_scale()
    {
        var carrier = new MappingEnsemble(Map("C", (0, 0), (300, 300)),
            [Map("C", (0, 0), (100, 100), (300, 320)), Map("C", (0, 0), (100, 100), (300, 280))]);
        var scale = ScaleContinuation.Of(carrier, 100, below: true)!;
        var a = Map("A", (0, 20), (200, 220));
        var b = Map("B", (0, 60), (100, 160), (200, 260));
        // Tolerance: arithmetic only. Member 0 stretches the scale past 100 by 10 %, member 1 shrinks it by 10 %.
        foreach (var (e, factor) in new[] { (0, 1.1), (1, 0.9) })
        {
            var movedA = scale.Apply(a, e);
            var movedB = scale.Apply(b, e);
            Assert.Equal(70, movedA.ToCompositeValue(50), 1e-9);
            Assert.Equal(100, movedA.ToCompositeValue(80), 1e-9);
            Assert.Equal(100 + factor * 100, movedA.ToCompositeValue(180), 1e-9);
            Assert.Equal(100 + factor * 100, movedB.ToCompositeValue(140), 1e-9); // the same level in both cores
            Assert.Equal(100 + factor * 160, movedB.ToCompositeValue(200), 1e-9);
        }
    }

    [Fact]
    public void A_member_past_the_base_keeps_rising_where_the_scale_s_perturbation_falls()
    {
        // Carrier member 0 lays 150-200 cm of C on one composite depth (a dtw staircase past the base): carried
        // over, A's 150-180 cm would be deposited in no time. Past the base each knot rises by at least a quarter of
        // the member's overall ratio (1: the checks' default largest rate jump, 4), least squares otherwise.
        var carrier = new MappingEnsemble(Map("C", (0, 0), (300, 300)), [Map("C", (0, 0), (150, 150), (200, 150), (300, 300))]);
        var scale = ScaleContinuation.Of(carrier, 100, below: true)!;
        var moved = scale.Apply(Map("A", [.. Enumerable.Range(0, 31).Select(k => (10.0 * k, 10.0 * k))]), 0);
        // Tolerance: arithmetic only. Inside the reference nothing moves.
        Assert.Equal(80, moved.ToCompositeValue(80), 1e-9);
        Assert.Equal(100, moved.ToCompositeValue(100), 1e-9);
        var knots = moved.CoreKnots.Zip(moved.CompositeKnots).Where(k => k.First >= 100).ToArray();
        foreach (var (lower, upper) in knots.Zip(knots.Skip(1)))
            Assert.True(upper.Second - lower.Second >= 0.25 * (upper.First - lower.First) - 1e-9, $"{lower} to {upper}");
        // The pooled stretch straddles the flat one: its mean is kept, so the scale is not pushed one way.
        Assert.Equal(300, moved.ToCompositeValue(300), 1e-9);
    }

    /// <summary>
    /// Both cores depart over the reference by a sinusoid of amplitude A = 2 cm and wavelength 20 cm
    /// of composite depth about their long-run lines: a straight continuation d further errs by a mean
    /// square of A^2 (1 - cos(2 pi d / 20)) (the mean over the phase u of (sin(u + v) - sin u)^2 is
    /// 1 - cos v), 2 cm at d = 5 and A sqrt 2 = 2.83 cm at d = 10 and, held outwards, beyond. With no
    /// spread of their own the members take that as their standard deviation past the base.
    /// </summary>
    [Fact]
    public void Past_the_base_the_members_spread_by_what_a_straight_continuation_is_measured_to_err()
    {
        const int members = 2000;
        double Wiggle(double y) => 2 * Math.Sin(2 * Math.PI * y / 20);
        var c = Core("C", 301);
        var k = Core("K", 251);
        var cMedian = new DepthMapping("C", Cm, [.. Enumerable.Range(0, 301).Select(i => (double)i)], [.. Enumerable.Range(0, 301).Select(i => i <= 100 ? i + Wiggle(i) : i)]);
        var kMedian = new DepthMapping("K", Cm, [.. Enumerable.Range(0, 251).Select(i => (double)i)], [.. Enumerable.Range(0, 251).Select(i => i <= 200 ? 0.5 * i + Wiggle(0.5 * i) : 100 + 0.6 * (i - 200))]);
        var widened = ScaleContinuation.WidenToMeasuredError(
            [(c, new MappingEnsemble(cMedian, Enumerable.Repeat(cMedian, members).ToArray())), (k, new MappingEnsemble(kMedian, Enumerable.Repeat(kMedian, members).ToArray()))],
            0, 100, below: true, step: 1, seed: 3);
        double Sd(IEnumerable<double> v)
        {
            var a = v.ToArray();
            double mean = a.Average();
            return Math.Sqrt(a.Sum(x => (x - mean) * (x - mean)) / (a.Length - 1));
        }
        // Tolerance 8 %: the sd of 2000 normal draws has a relative standard error of 1.6 % (three of
        // them 5 %), and the variogram of five wavelengths sampled every cm departs from the phase
        // mean by a few % more; fixed seed.
        Assert.Equal(2.0, Sd(widened[0].Members.Select(m => m.ToCompositeValue(105))), 0.08 * 2.0);
        Assert.Equal(2 * Math.Sqrt(2), Sd(widened[0].Members.Select(m => m.ToCompositeValue(150))), 0.08 * 2 * Math.Sqrt(2));
        // Tolerance: arithmetic only. The medians are kept, nothing moves inside the reference, and
        // member e of both cores is shifted alike at one level (composite 120: C's 120 cm, K's 233.3 cm).
        Assert.Same(cMedian, widened[0].Median);
        Assert.Same(kMedian, widened[1].Median);
        Assert.All(widened[1].Members, m => Assert.Equal(kMedian.ToCompositeValue(150), m.ToCompositeValue(150), 1e-9));
        for (int e = 0; e < members; e += 97)
            Assert.Equal(widened[0].Members[e].ToCompositeValue(120) - 120, widened[1].Members[e].ToCompositeValue(200 + 20 / 0.6) - 120, 1e-9);
    }
}
