using System.Globalization;

namespace StratLink.Quantities;

/// <summary>
/// A calendar age in years before AD 1950 (cal BP). Negative values are after 1950 (the coring year
/// 2018 CE is -68). Never mixes with a <see cref="RadiocarbonAge"/>: calibration turns one into a
/// distribution of the other.
/// </summary>
public readonly struct CalendarAge : IEquatable<CalendarAge>, IComparable<CalendarAge>
{
    /// <summary>The BP reference year (Stuiver and Polach 1977).</summary>
    public const int ReferenceYearCE = 1950;

    private CalendarAge(double yearsBP)
    {
        if (double.IsNaN(yearsBP)) throw new ArgumentException("An age cannot be NaN.", nameof(yearsBP));
        YearsBP = yearsBP;
    }

    public double YearsBP { get; }

    public static CalendarAge FromYearsBP(double yearsBP) => new(yearsBP);

    /// <summary>The age of a calendar year CE (AD); 2018 CE is -68 cal BP.</summary>
    public static CalendarAge FromYearCE(double yearCE) => new(ReferenceYearCE - yearCE);

    /// <summary>Years before AD 2000 (b2k, the ice-core convention) to cal BP: BP = b2k - 50.</summary>
    public static CalendarAge FromYearsB2k(double yearsB2k) => new(yearsB2k - 50);

    public double YearCE => ReferenceYearCE - YearsBP;

    public CalendarAge PlusYears(double years) => new(YearsBP + years);

    /// <summary>Years from <paramref name="younger"/> to this age (positive when this one is older).</summary>
    public double YearsOlderThan(CalendarAge younger) => YearsBP - younger.YearsBP;

    public static bool operator <(CalendarAge a, CalendarAge b) => a.YearsBP < b.YearsBP;
    public static bool operator >(CalendarAge a, CalendarAge b) => a.YearsBP > b.YearsBP;
    public static bool operator <=(CalendarAge a, CalendarAge b) => a.YearsBP <= b.YearsBP;
    public static bool operator >=(CalendarAge a, CalendarAge b) => a.YearsBP >= b.YearsBP;
    public static bool operator ==(CalendarAge a, CalendarAge b) => a.Equals(b);
    public static bool operator !=(CalendarAge a, CalendarAge b) => !a.Equals(b);

    public int CompareTo(CalendarAge other) => YearsBP.CompareTo(other.YearsBP);
    public bool Equals(CalendarAge other) => YearsBP == other.YearsBP;
    public override bool Equals(object? obj) => obj is CalendarAge a && Equals(a);
    public override int GetHashCode() => YearsBP.GetHashCode();
    public override string ToString() => YearsBP.ToString("0.#", CultureInfo.InvariantCulture) + " cal BP";
}
