using StratLink.AgeModelling;
using StratLink.Quantities;
using static StratLink.Tests.AgeModelling.AgeModelFixture;

namespace StratLink.Tests.AgeModelling;

public class AgeModelResultTests
{
    /// <summary>
    /// The many-depth path (members read along ascending depths, order statistics selected) against the one-depth
    /// path, which sorts every member's age and reads the type-7 percentiles (Hyndman and Fan 1996) from the sorted
    /// column: the same values to the bit, with walked curves and with monotone-spline curves, inside and beyond the
    /// controls. Controls and mappings are invented (10 yr/cm with noise, a core stretched 1.2 times).
    /// </summary>
    [Theory]
    [InlineData("linear", 0.3)]
    [InlineData("monotone-spline", 0.0)]
    public void ManyDepthsGiveTheOneDepthValuesToTheBit(string interpolation, double rateVariability)
    {
        var rng = new Random(5);
        var controls = new[] { 10.0, 60, 130, 210, 280 }
            .Select((d, k) => (Model.AgeControlSpec)Calendar($"c{k}", "R", d, 10 * d - 60 + 30 * (rng.NextDouble() - 0.5), 30)).ToList();
        var depths = new Dictionary<string, double[]> { ["R"] = Range(0, 300, 2), ["B"] = Range(0, 245, 2) };
        var project = Project(controls, depths, iterations: 301, seed: 9, interpolation: interpolation, rateVariability: rateVariability);
        var result = AgeModeller.Run(project, Aligned(Affine("R", 1, 0), AffineWithMembers("B", 1.2, 3, 2, 23)), NoVarves, null, CancellationToken.None);
        Assert.True(result.IsBuilt);

        var grid = Range(-20, 320, 0.7).Select(z => CompositeDepth.From(z, Unit)).ToArray();
        var med = new double[grid.Length];
        var lo = new double[grid.Length];
        var hi = new double[grid.Length];
        result.AgesAt(grid, med, lo, hi, CancellationToken.None);
        for (int r = 0; r < grid.Length; r++)
        {
            var (m, l, h) = result.AgeAt(grid[r]);
            Assert.Equal(m, med[r]);
            Assert.Equal(l, lo[r]);
            Assert.Equal(h, hi[r]);
        }
    }
}
