namespace StratLink.AgeModelling;

/// <summary>How ages are interpolated between control points in each Monte Carlo iteration.</summary>
public enum AgeInterpolation
{
    /// <summary>Straight lines between controls (linear interpolation, common practice).</summary>
    Linear,

    /// <summary>Monotone piecewise-cubic Hermite (Fritsch and Carlson 1980, SIAM J. Numer. Anal. 17:238-246).</summary>
    MonotoneSpline,
}

public static class AgeInterpolations
{
    /// <summary>The project file's names: <c>linear</c>, <c>monotone-spline</c>.</summary>
    public static AgeInterpolation Parse(string name) => name switch
    {
        "linear" => AgeInterpolation.Linear,
        "monotone-spline" => AgeInterpolation.MonotoneSpline,
        _ => throw new ArgumentException($"Unknown interpolation '{name}' (linear or monotone-spline).", nameof(name)),
    };

    public static string Name(this AgeInterpolation interpolation) =>
        interpolation == AgeInterpolation.MonotoneSpline ? "monotone-spline" : "linear";
}
