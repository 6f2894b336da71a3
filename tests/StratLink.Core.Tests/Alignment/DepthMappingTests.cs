using StratLink.Alignment;
using StratLink.Quantities;

namespace StratLink.Tests.Alignment;

public class DepthMappingTests
{
    private static readonly DepthMapping Map = new("B", DepthUnit.Centimetre, [0, 10, 30], [5, 25, 35]);

    [Theory]
    // Linear interpolation between knots (common practice), end segments extended with their slope.
    [InlineData(0, 5)]
    [InlineData(5, 15)]
    [InlineData(20, 30)]
    [InlineData(40, 40)]
    [InlineData(-2, 1)]
    public void Maps_core_depth_to_composite_and_back(double core, double composite)
    {
        Assert.Equal(composite, Map.ToComposite(CoreDepth.From(core, DepthUnit.Centimetre)).In(DepthUnit.Centimetre), 12);
        Assert.Equal(core, Map.ToCore(CompositeDepth.From(composite, DepthUnit.Centimetre)).In(DepthUnit.Centimetre), 12);
    }

    [Fact]
    public void Rate_ratio_is_the_local_slope()
    {
        Assert.Equal(2.0, Map.RateRatioAt(3), 12);
        Assert.Equal(0.5, Map.RateRatioAt(25), 12);
    }

    [Fact]
    public void Refuses_a_mapping_that_folds_back() =>
        Assert.Throws<ArgumentException>(() => new DepthMapping("B", DepthUnit.Centimetre, [0, 10, 5], [0, 1, 2]));
}
