using StratLink.Alignment;
using StratLink.Quantities;

namespace StratLink.Tests.Alignment;

/// <summary>
/// The continuation of a mapping past the matched end, on a worked example: aligned over 0-100 cm
/// at a rate ratio of 1.2, the core running to 200 cm, with two ties past the matched end (markers
/// carried through other cores). Straight lines between ties (as the ties method draws them) and
/// the fitted ratio beyond the last tie give the expected values by hand.
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
}
