using System.Globalization;

namespace StratLink.Quantities;

/// <summary>
/// A conventional radiocarbon age in 14C years BP (Libby half-life, d13C-normalised; Stuiver and
/// Polach 1977). It is a measurement, not a calendar age: calibration against a curve is needed.
/// </summary>
public readonly struct RadiocarbonAge : IEquatable<RadiocarbonAge>, IComparable<RadiocarbonAge>
{
    /// <summary>Libby mean-life, years: 5568 / ln 2 (Stuiver and Polach 1977).</summary>
    public const double LibbyMeanLife = 8033.0;

    private RadiocarbonAge(double years)
    {
        if (double.IsNaN(years)) throw new ArgumentException("A radiocarbon age cannot be NaN.", nameof(years));
        Years = years;
    }

    public double Years { get; }

    public static RadiocarbonAge FromYearsBP(double years) => new(years);

    /// <summary>CRA = -8033 ln F14C (Stuiver and Polach 1977; Reimer, Brown and Reimer 2004).</summary>
    public static RadiocarbonAge FromF14C(double f14c)
    {
        if (!(f14c > 0)) throw new ArgumentOutOfRangeException(nameof(f14c), f14c, "F14C must be positive.");
        return new(-LibbyMeanLife * Math.Log(f14c));
    }

    public double F14C => Math.Exp(-Years / LibbyMeanLife);

    public static bool operator <(RadiocarbonAge a, RadiocarbonAge b) => a.Years < b.Years;
    public static bool operator >(RadiocarbonAge a, RadiocarbonAge b) => a.Years > b.Years;
    public static bool operator ==(RadiocarbonAge a, RadiocarbonAge b) => a.Equals(b);
    public static bool operator !=(RadiocarbonAge a, RadiocarbonAge b) => !a.Equals(b);
    public static bool operator <=(RadiocarbonAge a, RadiocarbonAge b) => a.Years <= b.Years;
    public static bool operator >=(RadiocarbonAge a, RadiocarbonAge b) => a.Years >= b.Years;

    public int CompareTo(RadiocarbonAge other) => Years.CompareTo(other.Years);
    public bool Equals(RadiocarbonAge other) => Years == other.Years;
    public override bool Equals(object? obj) => obj is RadiocarbonAge a && Equals(a);
    public override int GetHashCode() => Years.GetHashCode();
    public override string ToString() => Years.ToString("0", CultureInfo.InvariantCulture) + " 14C yr BP";
}
