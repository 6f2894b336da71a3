using StratLink.Quantities;

namespace StratLink.Tests.Quantities;

public class QuantitiesTests
{
    [Fact]
    public void Depths_compare_across_units_and_keep_their_own()
    {
        var a = CoreDepth.From(152.3, DepthUnit.Centimetre);
        var b = CoreDepth.From(1.523, DepthUnit.Metre);
        Assert.Equal(DepthUnit.Centimetre, a.Unit);
        Assert.Equal(1523.0, a.In(DepthUnit.Millimetre), 9);
        Assert.Equal(0, a.CompareTo(b));
        Assert.True(CoreDepth.From(10, DepthUnit.Millimetre) < CoreDepth.From(1.1, DepthUnit.Centimetre));
        // Same unit: no conversion factor is applied, so values come back bit-identical.
        Assert.Equal(152.3, a.In(DepthUnit.Centimetre));
    }

    [Fact]
    public void An_interval_refuses_a_top_below_its_bottom()
    {
        Assert.Throws<ArgumentException>(() => DepthInterval.FromTopBottom(121.5, 118.0, DepthUnit.Centimetre));
        var gap = DepthInterval.FromTopBottom(118.0, 121.5, DepthUnit.Centimetre);
        Assert.True(gap.Contains(CoreDepth.From(1.2, DepthUnit.Metre)));
        Assert.False(gap.Contains(CoreDepth.From(121.6, DepthUnit.Centimetre)));
        Assert.Equal(3.5, gap.Length, 12);
    }

    [Fact]
    public void Calendar_ages_follow_the_BP_and_b2k_conventions()
    {
        // BP counts back from AD 1950 (Stuiver & Polach 1977); b2k from AD 2000, so BP = b2k - 50.
        Assert.Equal(-68, CalendarAge.FromYearCE(2018).YearsBP);
        Assert.Equal(1950, CalendarAge.FromYearsBP(0).YearCE);
        Assert.Equal(12121, CalendarAge.FromYearsB2k(12171).YearsBP);
    }

    [Theory]
    // Stuiver & Polach 1977: CRA = -8033 ln F14C; F14C 0.5 gives the Libby half-life 5568 yr (8033 ln 2 = 5568.0).
    [InlineData(0.5, 5568.0, 0.1)]
    // Reimer, Brown & Reimer 2004 give the pair F14C 0.9239 <-> 636 yr; the exact value is 635.8.
    [InlineData(0.9239, 635.8, 0.05)]
    public void Radiocarbon_age_from_F14C(double f14c, double expectedYears, double tolerance)
    {
        var age = RadiocarbonAge.FromF14C(f14c);
        Assert.InRange(age.Years, expectedYears - tolerance, expectedYears + tolerance);
        Assert.Equal(f14c, age.F14C, 12);
    }

    [Fact]
    public void Radiocarbon_refuses_non_positive_activity() =>
        Assert.Throws<ArgumentOutOfRangeException>(() => RadiocarbonAge.FromF14C(0));

    [Fact]
    public void Nan_is_not_a_depth_or_an_age()
    {
        Assert.Throws<ArgumentException>(() => CoreDepth.From(double.NaN, DepthUnit.Metre));
        Assert.Throws<ArgumentException>(() => CalendarAge.FromYearsBP(double.NaN));
    }
}
