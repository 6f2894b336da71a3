using System.Collections.Concurrent;
using StratLink.Checks;

namespace StratLink.AgeModelling.Calibration;

/// <summary>
/// Calibration curves read once per file path and kept: a project names the same curve for many dates,
/// and the dashboard re-runs the age model often. A file changed on disk (time or size) is read again.
/// </summary>
public sealed class CalibrationCurveCache
{
    private readonly ConcurrentDictionary<string, (DateTime Written, long Length, CalibrationCurve Curve)> _curves = new(StringComparer.Ordinal);

    /// <summary>The process-wide cache used by the age modeller and the command line.</summary>
    public static CalibrationCurveCache Shared { get; } = new();

    /// <summary>The curve at <paramref name="path"/>, read or reused; null with the problems added when it cannot be read.</summary>
    public CalibrationCurve? Get(string path, FindingList problems)
    {
        string full = Path.GetFullPath(path);
        var info = new FileInfo(full);
        if (!info.Exists)
        {
            problems.AddError(CalibrationCurve.CodeFormat, "calibration curve file not found", full);
            return null;
        }
        if (_curves.TryGetValue(full, out var hit) && hit.Written == info.LastWriteTimeUtc && hit.Length == info.Length)
            return hit.Curve;
        var curve = CalibrationCurve.Load(full, problems);
        if (curve is not null) _curves[full] = (info.LastWriteTimeUtc, info.Length, curve);
        return curve;
    }
}
