using System.Globalization;
using StratLink.Quantities;

namespace StratLink.AgeModelling.Calibration;

/// <summary>
/// Calibration of a conventional radiocarbon age by the standard probability method: the curve is
/// interpolated onto whole calendar years and, with a uniform prior,
/// p(theta) ~ exp(-(m - mu(theta))^2 / (2 (s^2 + sigma(theta)^2))) / sqrt(s^2 + sigma(theta)^2),
/// the curve's error added in quadrature (Stuiver and Reimer 1993, Radiocarbon 35:215-230; Bronk Ramsey
/// 2009, Radiocarbon 51:337-360). A reservoir offset Delta-R with error is taken off the measurement,
/// m - Delta-R with sqrt(s^2 + sigma_DR^2) (Stuiver, Pearson and Braziunas 1986); a marine fraction f mixes
/// curves as mu = f mu_marine + (1 - f) mu_atm (common practice).
/// </summary>
public static class Calibrator
{
    /// <summary>A date whose measurement lies more than this many combined sigmas outside every curve value has no calendar age on that curve.</summary>
    public const double OutsideCurveSigmas = 2.0;

    /// <summary>A density still at this share of its peak at an end of the curve is reported as cut there.</summary>
    public const double TruncationShare = 0.01;

    /// <summary>Weights below this share of the peak are trimmed from the stored density.</summary>
    private const double TrimShare = 1e-12;

    /// <summary>
    /// Calibrates <paramref name="c14Age"/> +- <paramref name="c14Error"/> against <paramref name="curve"/>.
    /// With <paramref name="marineFraction"/> set, <paramref name="curve"/> is the marine curve (Delta-R applies
    /// to its share) and <paramref name="atmosphericCurve"/> the other end-member.
    /// </summary>
    public static CalibrationResult Calibrate(RadiocarbonAge c14Age, double c14Error, CalibrationCurve curve,
        double deltaR = 0, double deltaRError = 0, double? marineFraction = null, CalibrationCurve? atmosphericCurve = null)
    {
        if (!(c14Error > 0)) throw new ArgumentOutOfRangeException(nameof(c14Error), c14Error, "A radiocarbon error must be positive.");
        if (!(deltaRError >= 0)) throw new ArgumentOutOfRangeException(nameof(deltaRError), deltaRError, "A reservoir error cannot be negative.");
        if (marineFraction is double fr && !(fr >= 0 && fr <= 1)) throw new ArgumentOutOfRangeException(nameof(marineFraction), fr, "The marine fraction is between 0 and 1.");
        if (marineFraction is not null && atmosphericCurve is null) throw new ArgumentException("A marine fraction needs the atmospheric curve to mix with.", nameof(atmosphericCurve));

        double f = marineFraction ?? 1.0;
        double m = c14Age.Years - f * deltaR;
        double s2 = c14Error * c14Error + f * f * deltaRError * deltaRError;
        string curveName = marineFraction is null ? curve.Name : $"{f.ToString("0.###", CultureInfo.InvariantCulture)} x {curve.Name} + {(1 - f).ToString("0.###", CultureInfo.InvariantCulture)} x {atmosphericCurve!.Name}";

        // The 1-yr grid common to both curves.
        int start = curve.GridStartBP, end = curve.GridStartBP + curve.GridMu.Count - 1;
        if (atmosphericCurve is not null && marineFraction is not null)
        {
            start = Math.Max(start, atmosphericCurve.GridStartBP);
            end = Math.Min(end, atmosphericCurve.GridStartBP + atmosphericCurve.GridMu.Count - 1);
        }
        int n = end - start + 1;
        if (n < 1) throw new ArgumentException($"The curves {curve.Name} and {atmosphericCurve?.Name} share no calendar years.");

        var logL = new double[n];
        double maxLog = double.NegativeInfinity;
        bool anyYounger = false, anyOlder = false, anyWithin = false;
        var muM = curve.GridMuArray;
        var sgM = curve.GridSigmaArray;
        int offM = start - curve.GridStartBP;
        double[]? muA = atmosphericCurve?.GridMuArray, sgA = atmosphericCurve?.GridSigmaArray;
        int offA = atmosphericCurve is null ? 0 : start - atmosphericCurve.GridStartBP;
        bool mixed = marineFraction is not null;
        for (int k = 0; k < n; k++)
        {
            double mu, var;
            if (mixed)
            {
                double sm = f * sgM[k + offM], sa = (1 - f) * sgA![k + offA];
                mu = f * muM[k + offM] + (1 - f) * muA![k + offA];
                var = s2 + sm * sm + sa * sa;
            }
            else
            {
                mu = muM[k + offM];
                var = s2 + sgM[k + offM] * sgM[k + offM];
            }
            double z = (m - mu) / Math.Sqrt(var);
            if (z > OutsideCurveSigmas) anyOlder = true;
            else if (z < -OutsideCurveSigmas) anyYounger = true;
            else anyWithin = true;
            logL[k] = -0.5 * z * z - 0.5 * Math.Log(var);
            if (logL[k] > maxLog) maxLog = logL[k];
        }

        double sEff = Math.Sqrt(s2);
        string measured = $"{m.ToString("0", CultureInfo.InvariantCulture)} +- {sEff.ToString("0", CultureInfo.InvariantCulture)} 14C yr BP";
        if (!anyWithin && !anyOlder)
            return Failed(CalibrationStatus.Modern, $"{measured} is younger than every 14C age on {curveName} by more than {OutsideCurveSigmas} sigma: the sample is modern (or post-bomb) and has no calendar age on this curve.");
        if (!anyWithin && !anyYounger)
            return Failed(CalibrationStatus.TooOld, $"{measured} is older than {curveName} reaches ({(end).ToString(CultureInfo.InvariantCulture)} cal BP) by more than {OutsideCurveSigmas} sigma: no calendar age on this curve.");

        var w = new double[n];
        for (int k = 0; k < n; k++) w[k] = Math.Exp(logL[k] - maxLog);
        bool cutYoung = w[0] >= TruncationShare, cutOld = w[^1] >= TruncationShare;
        int first = 0, last = n - 1;
        while (first < last && w[first] < TrimShare) first++;
        while (last > first && w[last] < TrimShare) last--;
        var density = new CalibratedDensity(start + first, w[first..(last + 1)]);

        string? message = null;
        if (cutYoung)
            message = $"{measured} reaches the young end of {curveName} ({start.ToString(CultureInfo.InvariantCulture)} cal BP): the sample may be modern, and the ranges stop there.";
        else if (cutOld)
            message = $"{measured} reaches the old end of {curveName} ({end.ToString(CultureInfo.InvariantCulture)} cal BP): the sample may be older, and the ranges stop there.";
        return new CalibrationResult
        {
            Status = message is null ? CalibrationStatus.Ok : CalibrationStatus.Truncated,
            Message = message,
            Density = density,
            EffectiveC14Age = m,
            EffectiveC14Error = sEff,
            CurveName = curveName,
        };

        CalibrationResult Failed(CalibrationStatus status, string text) => new()
        {
            Status = status, Message = text, EffectiveC14Age = m, EffectiveC14Error = sEff, CurveName = curveName,
        };
    }
}
