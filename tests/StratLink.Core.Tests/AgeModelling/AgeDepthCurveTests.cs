using StratLink.AgeModelling;
using StratLink.Quantities;

namespace StratLink.Tests.AgeModelling;

/// <summary>The coring year as the youngest age: cal BP counts years before 1950 CE (Stuiver and Polach 1977), so 2019 CE is -69 cal BP.</summary>
public class AgeDepthCurveTests
{
    private static readonly double Coring2019 = CalendarAge.FromYearCE(2019).YearsBP;

    [Fact]
    public void Above_the_surface_a_curve_held_at_the_coring_year_stays_there_and_keeps_its_rate()
    {
        // Controls at 10 cm (-20 cal BP) and 30 cm (80 cal BP): 5 yr/cm, extrapolated to -70 cal BP at 0 cm.
        var curve = new AgeDepthCurve([10, 30], [-20, 80], AgeInterpolation.Linear);
        Assert.Equal(-70, curve.AgeAt(0), 1e-9);
        var held = curve.NoYoungerThan(Coring2019);
        Assert.Equal(-69, Coring2019);
        Assert.Equal(-69, held.AgeAt(0, out double yearsPerCm), 1e-9);
        Assert.Equal(5, yearsPerCm, 1e-9);
        Assert.Equal(-69, held.AgeAt(-30), 1e-9);
        // Below the depth where it reaches the coring year the curve is unchanged.
        Assert.Equal(curve.AgeAt(0.4), held.AgeAt(0.4), 1e-9);
        Assert.Equal(curve.AgeAt(20), held.AgeAt(20), 1e-9);
    }
}
