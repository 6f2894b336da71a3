using StratLink.AgeModelling.Calibration;
using StratLink.AgeModelling.Radiocarbon;
using StratLink.Checks;
using StratLink.Quantities;

namespace StratLink.Tests.AgeModelling;

public class CalibrationCurveTests
{
    [Theory]
    // Row counts as distributed: IntCal20 (Reimer et al. 2020) 9,501 rows, Marine20 (Heaton et al. 2020) 5,501 rows, both 0-55,000 cal BP.
    [InlineData("intcal20.14c", 9501)]
    [InlineData("marine20.14c", 5501)]
    public void RealCurvesParseToPublishedRowCounts(string file, int rows)
    {
        var problems = new FindingList();
        var curve = CalibrationCurve.Load(TestCurves.PathOf(file), problems);
        Assert.Empty(problems);
        Assert.NotNull(curve);
        Assert.Equal(rows, curve.Count);
        Assert.Equal(0, curve.CalBP[0]);
        Assert.Equal(55000, curve.CalBP[^1]);
        Assert.Equal(55001, curve.GridMu.Count);
    }

    [Theory]
    // Curve self-consistency (methods: Delta14C = 1000 [exp(theta/8267 - r/8033) - 1], Stuiver and Polach 1977):
    // Delta14C recomputed from the rounded columns 1-2 must match column 4 to rounding. Rounding r to 1 yr moves
    // Delta14C by up to 0.5/8033 x 1000 x 1.53 = 0.095 permil, column 4 is rounded to 0.05: 0.15 permil.
    // The curves give the mean over realisations in F14C, which for a normal 14C age exceeds exp(-r/8033) by
    // the factor exp(sigma^2 / (2 x 8033^2)) (log-normal mean): up to 12 permil at the old end (sigma 1000 yr),
    // under 0.12 permil where sigma <= 100 yr. Checks: the plain formula where sigma <= 100 yr, and the formula
    // with the log-normal factor everywhere, each within 0.15 + 0.12 = 0.27, rounded to 0.3 permil.
    [InlineData("intcal20.14c")]
    [InlineData("marine20.14c")]
    public void Delta14CMatchesColumnsOneAndTwo(string file)
    {
        var curve = CalibrationCurve.Load(TestCurves.PathOf(file), new FindingList())!;
        Assert.NotNull(curve.Delta14C);
        const double tau = 8033;
        double worstPlain = 0, worstLogNormal = 0;
        int plainRows = 0;
        for (int i = 0; i < curve.Count; i++)
        {
            double plain = RadiocarbonUnits.Delta14C(CalendarAge.FromYearsBP(curve.CalBP[i]), RadiocarbonAge.FromYearsBP(curve.C14Age[i]));
            double s = curve.C14Sigma[i];
            double logNormal = (1000 + plain) * Math.Exp(s * s / (2 * tau * tau)) - 1000;
            if (s <= 100)
            {
                plainRows++;
                worstPlain = Math.Max(worstPlain, Math.Abs(plain - curve.Delta14C![i]));
            }
            worstLogNormal = Math.Max(worstLogNormal, Math.Abs(logNormal - curve.Delta14C![i]));
        }
        Assert.True(plainRows > 1000, $"{plainRows} rows with sigma <= 100 yr");
        Assert.True(worstPlain <= 0.3, $"largest Delta14C mismatch (plain formula, sigma <= 100 yr) {worstPlain:0.###} permil in {file}");
        Assert.True(worstLogNormal <= 0.3, $"largest Delta14C mismatch (log-normal mean) {worstLogNormal:0.###} permil in {file}");
    }

    [Fact]
    public void ToleratesLineEndsSpacesAndEitherRowOrder()
    {
        // Format per IntCal20 distribution (Reimer et al. 2020): '#' headers, comma-separated rows, oldest first.
        string text = "##Test curve\r\n# CAL BP, 14C age,Sigma,Delta 14C,Sigma\r\n 200, 210 , 12,1.0,1\r100,120, 11,2.0,1\n\n0, 20,10,3.0,1\r\n";
        var problems = new FindingList();
        var curve = CalibrationCurve.Parse(text, "t.14c", problems)!;
        Assert.Empty(problems);
        Assert.Equal([0.0, 100.0, 200.0], curve.CalBP);
        Assert.Equal([20.0, 120.0, 210.0], curve.C14Age);
        Assert.Equal(70, curve.GridMu[50], 1e-12);
        Assert.Equal(10.5, curve.GridSigma[50], 1e-12);
    }

    [Fact]
    public void BadRowNamesFileLineAndColumn()
    {
        var problems = new FindingList();
        var curve = CalibrationCurve.Parse("# h\n100,120,11\n50,abc,10\n", "bad.14c", problems);
        Assert.Null(curve);
        var f = Assert.Single(problems);
        Assert.Equal("bad.14c", f.File);
        Assert.Equal(3, f.Line);
        Assert.Equal("14C age", f.Field);
    }

    [Fact]
    public void RepeatedCalendarAgeIsRefused()
    {
        var problems = new FindingList();
        Assert.Null(CalibrationCurve.Parse("100,120,11\n50,60,10\n50,61,10\n", "rep.14c", problems));
        Assert.Equal(3, Assert.Single(problems).Line);
    }

    [Fact]
    public void CacheReadsAFileOnce()
    {
        var cache = new CalibrationCurveCache();
        var a = cache.Get(TestCurves.PathOf("marine20.14c"), new FindingList());
        var b = cache.Get(TestCurves.PathOf("marine20.14c"), new FindingList());
        Assert.NotNull(a);
        Assert.Same(a, b);
        var problems = new FindingList();
        Assert.Null(cache.Get(Path.Combine(Path.GetTempPath(), "no-such-curve.14c"), problems));
        Assert.Contains("not found", Assert.Single(problems).Message);
    }
}
