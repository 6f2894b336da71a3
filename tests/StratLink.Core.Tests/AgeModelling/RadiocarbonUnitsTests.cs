using StratLink.AgeModelling.Radiocarbon;
using StratLink.Quantities;

namespace StratLink.Tests.AgeModelling;

public class RadiocarbonUnitsTests
{
    [Fact]
    public void HalfModernIsOneLibbyHalfLife()
    {
        // Stuiver and Polach 1977: CRA = -8033 ln F14C; F14C = 0.5 gives the Libby half-life 5568 yr.
        var (age, _) = RadiocarbonUnits.AgeFromF14C(0.5, 0.001);
        Assert.Equal(5568, age.Years, 0.5);
    }

    [Fact]
    public void DocumentedPair0p9239Is636Years()
    {
        // Reimer, Brown and Reimer 2004 worked pair 0.9239 <-> 636 yr; exact value 635.8 from the formula.
        var (age, _) = RadiocarbonUnits.AgeFromF14C(0.9239, 0.0);
        Assert.Equal(635.8, age.Years, 0.05);
        Assert.Equal(636, Math.Round(age.Years));
    }

    [Fact]
    public void ErrorsPropagateBothWays()
    {
        // sigma_CRA = 8033 sigma_F / F (first-order propagation of CRA = -8033 ln F; methods common practice).
        var (age, err) = RadiocarbonUnits.AgeFromF14C(0.5, 0.005);
        Assert.Equal(80.33, err, 1e-9);
        var (f, ferr) = RadiocarbonUnits.F14CFromAge(age, err);
        Assert.Equal(0.5, f, 1e-12);
        Assert.Equal(0.005, ferr, 1e-12);
    }

    [Theory]
    // Stuiver and Polach 1977 normalisation to -25 permil: a sample measured at 0 permil but left
    // unnormalised differs by 412 yr (linear form) or 407 yr (ratio form); values computed from the formulas.
    [InlineData(true, 412.0)]
    [InlineData(false, 407.0)]
    public void D13CNormalisationShiftsAge(bool approximate, double expectedYears)
    {
        double normalised = RadiocarbonUnits.NormaliseTo25Permil(1.0, 0.0, approximate);
        double shift = RadiocarbonAge.FromF14C(normalised).Years - RadiocarbonAge.FromF14C(1.0).Years;
        Assert.Equal(expectedYears, shift, 0.5);
        Assert.Equal(1.0, RadiocarbonUnits.NormaliseTo25Permil(1.0, -25.0, approximate), 1e-12);
    }

    [Fact]
    public void PercentModernAndDeltas()
    {
        // Reimer, Brown and Reimer 2004: pMC = 100 F14C; D14C = (F14C - 1) 1000; Delta14C equals D14C for growth in 1950.
        Assert.Equal(92.39, RadiocarbonUnits.PercentModern(0.9239), 1e-9);
        Assert.Equal(0.9239, RadiocarbonUnits.F14CFromPercentModern(92.39), 1e-12);
        Assert.Equal(-76.1, RadiocarbonUnits.SmallDelta14C(0.9239), 1e-9);
        Assert.Equal(RadiocarbonUnits.SmallDelta14C(0.9239), RadiocarbonUnits.Delta14C(0.9239, 1950), 1e-9);
        // Growth 8267 yr before 1950 at F14C = e^-1 is exactly the decay-corrected modern level: Delta14C = 0.
        Assert.Equal(0.0, RadiocarbonUnits.Delta14C(Math.Exp(-1), 1950 - 8267), 1e-9);
    }

    [Fact]
    public void NonPositiveF14CIsRejected()
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => RadiocarbonUnits.AgeFromF14C(0, 0.01));
    }
}
