using StratLink.Alignment;
using StratLink.Quantities;

namespace StratLink.Tests.Alignment;

/// <summary>
/// Members read within the resolution of their cells: the shift of a member is uniform on +/- r/2,
/// so over many draws its mean is 0 and its variance r^2 / 12 (the variance of a uniform quantisation
/// error; Sheppard 1898, from memory), within 5 standard errors (seeded, 20,000 draws); r is the grid
/// step, or the records' own sample spacing where that is coarser; exact ties still hold.
/// </summary>
public class MatchResolutionTests
{
    private const int Draws = 20000;

    private static PreparedSignals Grid(int rows, double step, double[]? spacing = null) =>
        new("C", 0, step, rows, ["x"], new double[rows], spacing);

    private static double[] Shifts(MatchResolution resolution, DepthMapping member, double coreDepth)
    {
        var rng = new Random(11);
        return [.. Enumerable.Range(0, Draws).Select(_ => resolution.Spread(member, rng).ToCompositeValue(coreDepth) - member.ToCompositeValue(coreDepth))];
    }

    private static void AssertUniform(double[] shifts, double r)
    {
        double mean = shifts.Average(), variance = shifts.Sum(s => (s - mean) * (s - mean)) / (shifts.Length - 1);
        // Standard errors of the mean (sd / sqrt n) and of the variance of a uniform (sqrt((mu4 - sigma^4) / n), mu4 = r^4 / 80).
        double sd = r / Math.Sqrt(12), seVariance = Math.Sqrt((Math.Pow(r, 4) / 80 - Math.Pow(sd, 4)) / shifts.Length);
        Assert.InRange(mean, -5 * sd / Math.Sqrt(shifts.Length), 5 * sd / Math.Sqrt(shifts.Length));
        Assert.InRange(variance, r * r / 12 - 5 * seVariance, r * r / 12 + 5 * seVariance);
        Assert.All(shifts, s => Assert.InRange(s, -r / 2 - 1e-12, r / 2 + 1e-12));
    }

    [Fact]
    public void A_member_is_shifted_uniformly_within_one_grid_step()
    {
        var resolution = new MatchResolution(Grid(101, 0.5), Grid(121, 0.5), []);
        var member = new DepthMapping("C", DepthUnit.Centimetre, [0, 20, 50], [0, 30, 60]);
        AssertUniform(Shifts(resolution, member, 25), 0.5);
    }

    [Fact]
    public void Where_the_reference_was_sampled_coarsely_the_shift_spans_its_spacing()
    {
        // Reference rows 40-60 (20-30 cm) were read from samples 3 cm apart; elsewhere it was sampled on the grid.
        var spacing = Enumerable.Range(0, 121).Select(r => r is >= 40 and <= 60 ? 3.0 : 0.5).ToArray();
        var resolution = new MatchResolution(Grid(101, 0.5), Grid(121, 0.5, spacing), []);
        var member = DepthMapping.Identity("C", DepthUnit.Centimetre, 0, 50);
        AssertUniform(Shifts(resolution, member, 25), 3);
        AssertUniform(Shifts(resolution, member, 10), 0.5);
    }

    [Fact]
    public void Every_member_still_passes_through_an_exact_tie()
    {
        var resolution = new MatchResolution(Grid(101, 0.5), Grid(121, 0.5), [20]);
        var member = new DepthMapping("C", DepthUnit.Centimetre, [0, 50], [0, 60]);
        var rng = new Random(5);
        for (int e = 0; e < 200; e++)
        {
            var spread = resolution.Spread(member, rng);
            Assert.Equal(24, spread.ToCompositeValue(20), 1e-9);
        }
        // One resolution away from the tie the shift is whole again: here the core's 0.5 cm grid at a
        // rate ratio of 1.2 (0.6 cm of composite depth) is coarser than the reference's.
        AssertUniform(Shifts(resolution, member, 30), 0.6);
    }
}
