using StratLink.AgeModelling.Calibration;
using StratLink.Model;
using StratLink.Workflows;

namespace StratLink.Checks;

/// <summary>
/// The radiocarbon controls of a project calibrated once for the checks, with the age model's own
/// curve reader and calibrator, so the checks and the age model never disagree about a date.
/// </summary>
internal sealed class RadiocarbonDates(LoadedProject loaded)
{
    private readonly Dictionary<string, (CalibrationResult? Result, string? Problem)> _done = new(StringComparer.Ordinal);

    /// <summary>
    /// The calibration of <paramref name="rc"/>, or null with the reason: the curve file is missing (the
    /// loader reports that), cannot be read (<paramref name="problem"/> says why), or the values are unusable.
    /// </summary>
    public CalibrationResult? Calibrate(RadiocarbonAgeControl rc, out string? problem)
    {
        if (!_done.TryGetValue(rc.Id, out var done)) _done[rc.Id] = done = Run(rc);
        problem = done.Problem;
        return done.Result;
    }

    /// <summary>Calendar age and 1 sigma of a usable calibration (median and standard deviation of the density).</summary>
    public AgeEstimate? Estimate(RadiocarbonAgeControl rc) =>
        Calibrate(rc, out _) is { Density: { } d } ? new AgeEstimate(d.Median, d.StandardDeviation) : null;

    private (CalibrationResult?, string?) Run(RadiocarbonAgeControl rc)
    {
        var curve = Curve(rc.Curve, out string? problem);
        if (curve is null) return (null, problem);
        CalibrationCurve? atmospheric = null;
        if (rc.AtmosphericCurve is not null && (atmospheric = Curve(rc.AtmosphericCurve, out problem)) is null) return (null, problem);
        try
        {
            return (Calibrator.Calibrate(rc.C14Age, rc.C14Error, curve, rc.ReservoirOffset, rc.ReservoirError, rc.MarineFraction, atmospheric), null);
        }
        catch (ArgumentException e)
        {
            // Values the reader already refused (a zero error, a fraction without its curve): not the checks' finding.
            return (null, e.Message);
        }
    }

    private CalibrationCurve? Curve(string relative, out string? problem)
    {
        problem = null;
        string path = loaded.Document.Resolve(relative);
        if (!File.Exists(path)) return null;
        var problems = new FindingList();
        var curve = CalibrationCurveCache.Shared.Get(path, problems);
        if (curve is null) problem = problems.FirstOrDefault()?.Message ?? "the curve has no usable rows";
        return curve;
    }
}
