using StratLink.AgeModelling.Calibration;
using StratLink.Quantities;

namespace StratLink.Tests.AgeModelling;

public class CalibratorTests
{
    /// <summary>Synthetic straight-line curve mu(theta) = theta + offset, constant sigma, uneven row spacing.</summary>
    private static CalibrationCurve Line(double offset, double sigma, string name = "line")
    {
        var cal = new List<double>();
        for (double t = 0; t <= 4000; t += t < 2000 ? 5 : 20) cal.Add(t);
        return CalibrationCurve.FromArrays(name, [.. cal], [.. cal.Select(t => t + offset)], [.. cal.Select(_ => sigma)]);
    }

    [Fact]
    public void StraightLineCurveGivesAnalyticHpd()
    {
        // Standard probability method (Stuiver and Reimer 1993) on mu(theta) = theta, sigma 30, m = 1000 +- 50:
        // the posterior is normal with sigma sqrt(50^2 + 30^2) = 58.31. On an integer grid the 68.27 % HPD is
        // 942-1058 and the 95.45 % HPD 883-1116 (computed from the normal formula; the 95 % tie goes to the younger year).
        var r = Calibrator.Calibrate(RadiocarbonAge.FromYearsBP(1000), 50, Line(0, 30));
        Assert.Equal(CalibrationStatus.Ok, r.Status);
        var d = r.Density!;
        Assert.Equal(1.0, d.Probabilities.Sum(), 1e-12);
        Assert.Equal(1000, d.Median, 0.01);
        Assert.Equal(58.31, d.StandardDeviation, 0.01);
        var h68 = Assert.Single(d.Hpd(CalibratedDensity.OneSigmaLevel));
        Assert.Equal((942, 1058), (h68.YoungBP, h68.OldBP));
        Assert.Equal(0.6843, h68.Probability, 0.0005);
        var h95 = Assert.Single(d.Hpd(CalibratedDensity.TwoSigmaLevel));
        Assert.Equal((883, 1116), (h95.YoungBP, h95.OldBP));
        // Inverse CDF at Phi(1) = 0.8413 is one sigma above the mean (normal quantile), to the grid's resolution.
        Assert.Equal(1058.31, d.InverseCdf(0.841345), 0.5);
    }

    [Fact]
    public void RealCurveDensityIntegratesToOne()
    {
        var r = Calibrator.Calibrate(RadiocarbonAge.FromYearsBP(5000), 35, TestCurves.IntCal20);
        Assert.Equal(CalibrationStatus.Ok, r.Status);
        Assert.Equal(1.0, r.Density!.Probabilities.Sum(), 1e-12);
        double hpd = r.Density.Hpd(CalibratedDensity.TwoSigmaLevel).Sum(h => h.Probability);
        Assert.InRange(hpd, 0.9545, 0.9545 + 0.01);
        // 5000 14C yr BP falls near 5700-5900 cal BP on IntCal20 (from memory, common practice; wide bound).
        Assert.InRange(r.Density.Median, 5600, 5900);
    }

    [Fact]
    public void HallstattPlateauGivesWideMultiModalRange()
    {
        // The Hallstatt plateau (about 2750-2400 cal BP, 14C ages near 2450; common practice): a 2450 +- 30 date
        // spreads over it. A straight curve would give a 95 % width of about 4 x 32 = 128 yr; require > 250 yr
        // and more than one 68 % range.
        var d = Calibrator.Calibrate(RadiocarbonAge.FromYearsBP(2450), 30, TestCurves.IntCal20).Density!;
        var h95 = d.Hpd(CalibratedDensity.TwoSigmaLevel);
        Assert.True(h95[^1].OldBP - h95[0].YoungBP > 250, $"95 % span {h95[0].YoungBP}-{h95[^1].OldBP}");
        Assert.True(d.Hpd(CalibratedDensity.OneSigmaLevel).Length > 1);
        Assert.InRange(h95[0].YoungBP, 2300, 2500);
        Assert.InRange(h95[^1].OldBP, 2600, 2800);
    }

    [Fact]
    public void ReservoirOffsetShiftsAndWidens()
    {
        // Calibrate (m - DeltaR, sqrt(s^2 + sigma_DR^2)) (Stuiver, Pearson and Braziunas 1986). On a straight
        // curve the posterior is normal: median 1000 - 120 = 880, sigma sqrt(50^2 + 40^2 + 30^2) = 70.71.
        var r = Calibrator.Calibrate(RadiocarbonAge.FromYearsBP(1000), 50, Line(0, 30), deltaR: 120, deltaRError: 40);
        Assert.Equal(880, r.Density!.Median, 0.01);
        Assert.Equal(70.71, r.Density.StandardDeviation, 0.01);
        Assert.Equal(880, r.EffectiveC14Age, 1e-12);
        Assert.Equal(64.03, r.EffectiveC14Error, 0.01);

        // On Marine20 a Delta-R without error equals calibrating the shifted age.
        var a = Calibrator.Calibrate(RadiocarbonAge.FromYearsBP(4000), 40, TestCurves.Marine20, deltaR: 150).Density!;
        var b = Calibrator.Calibrate(RadiocarbonAge.FromYearsBP(3850), 40, TestCurves.Marine20).Density!;
        Assert.Equal(b.StartBP, a.StartBP);
        Assert.Equal(b.Probabilities, a.Probabilities);
        // A positive Delta-R makes the calendar age younger.
        var c = Calibrator.Calibrate(RadiocarbonAge.FromYearsBP(4000), 40, TestCurves.Marine20).Density!;
        Assert.True(a.Median < c.Median - 100);
    }

    [Fact]
    public void MarineFractionMixesCurves()
    {
        // mu = f mu_marine + (1 - f) mu_atm (common practice). Marine line is atmospheric + 400 yr, so a half
        // mixture is the atmospheric line + 200: median 1200 - 200 = 1000; sigma sqrt(50^2 + (0.5 x 30)^2 x 2).
        var marine = Line(400, 30, "marine");
        var atm = Line(0, 30, "atm");
        var half = Calibrator.Calibrate(RadiocarbonAge.FromYearsBP(1200), 50, marine, marineFraction: 0.5, atmosphericCurve: atm).Density!;
        Assert.Equal(1000, half.Median, 0.01);
        Assert.Equal(Math.Sqrt(2500 + 2 * 225), half.StandardDeviation, 0.01);
        var allMarine = Calibrator.Calibrate(RadiocarbonAge.FromYearsBP(1200), 50, marine, marineFraction: 1, atmosphericCurve: atm).Density!;
        Assert.Equal(800, allMarine.Median, 0.01);
        var allAtm = Calibrator.Calibrate(RadiocarbonAge.FromYearsBP(1200), 50, marine, deltaR: 300, marineFraction: 0, atmosphericCurve: atm).Density!;
        Assert.Equal(1200, allAtm.Median, 0.01);
    }

    [Fact]
    public void ModernAndTooOldHaveNoCalendarAge()
    {
        // IntCal20's youngest 14C ages are 95 +- 10 yr BP (Reimer et al. 2020 file): -100 +- 30 is 6 sigma younger.
        var modern = Calibrator.Calibrate(RadiocarbonAge.FromYearsBP(-100), 30, TestCurves.IntCal20);
        Assert.Equal(CalibrationStatus.Modern, modern.Status);
        Assert.Null(modern.Density);
        Assert.Contains("modern", modern.Message);

        // The oldest IntCal20 row is 50100 +- 1024 14C yr BP at 55,000 cal BP.
        var old = Calibrator.Calibrate(RadiocarbonAge.FromYearsBP(60000), 500, TestCurves.IntCal20);
        Assert.Equal(CalibrationStatus.TooOld, old.Status);
        Assert.Null(old.Density);

        // 150 +- 30 overlaps the curve but runs into its young end (0 cal BP, 199 +- 11): usable, with a warning.
        var young = Calibrator.Calibrate(RadiocarbonAge.FromYearsBP(150), 30, TestCurves.IntCal20);
        Assert.Equal(CalibrationStatus.Truncated, young.Status);
        Assert.Contains("young end", young.Message);
        Assert.Equal(0, young.Density!.StartBP);
    }

    [Fact]
    public void RoundingOutwardMergesTouchingRanges()
    {
        // Report practice (methods section 1, common practice): round HPD ranges outward to 5 or 10 yr.
        var d = new CalibratedDensity(100, [1, 1, 1, 0, 1, 1, 0, 0, 0, 0, 0, 0, 1]);
        var exact = d.Hpd(1.0);
        Assert.Equal([(100, 102), (104, 105), (112, 112)], exact.Select(r => (r.YoungBP, r.OldBP)));
        Assert.Equal([0.5, 1 / 3.0, 1 / 6.0], exact.Select(r => Math.Round(r.Probability, 12)).ToArray(), new RoundedComparer());
        var rounded = d.HpdRoundedOutward(1.0, 5);
        Assert.Equal(2, rounded.Length);
        Assert.Equal((100, 105), (rounded[0].YoungBP, rounded[0].OldBP));
        Assert.Equal(5 / 6.0, rounded[0].Probability, 1e-12);
        Assert.Equal((110, 115), (rounded[1].YoungBP, rounded[1].OldBP));
    }

    [Fact]
    public void NonPositiveErrorIsRejected()
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => Calibrator.Calibrate(RadiocarbonAge.FromYearsBP(1000), 0, Line(0, 30)));
    }

    private sealed class RoundedComparer : IEqualityComparer<double>
    {
        public bool Equals(double a, double b) => Math.Abs(a - b) < 1e-12;
        public int GetHashCode(double v) => 0;
    }
}
