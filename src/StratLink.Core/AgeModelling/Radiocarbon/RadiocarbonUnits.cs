using StratLink.Quantities;

namespace StratLink.AgeModelling.Radiocarbon;

/// <summary>
/// Radiocarbon reporting arithmetic (Stuiver and Polach 1977, Radiocarbon 19:355-363; Reimer, Brown and
/// Reimer 2004, Radiocarbon 46:1299-1304): F14C, conventional radiocarbon age (Libby mean-life 8033 yr),
/// d13C normalisation, pMC, D14C and Delta14C. Errors are 1 sigma and propagated to first order.
/// </summary>
public static class RadiocarbonUnits
{
    /// <summary>Libby mean-life, years (half-life 5568 = 8033 ln 2): used for every conventional age.</summary>
    public const double LibbyMeanLife = RadiocarbonAge.LibbyMeanLife;

    /// <summary>Mean-life from the true ("Cambridge") half-life 5730 yr, used for Delta14C's decay correction.</summary>
    public const double CambridgeMeanLife = 8267.0;

    /// <summary>CRA = -8033 ln F14C, sigma = 8033 sigma_F / F.</summary>
    public static (RadiocarbonAge Age, double Error) AgeFromF14C(double f14c, double f14cError)
    {
        if (!(f14c > 0)) throw new ArgumentOutOfRangeException(nameof(f14c), f14c, "F14C must be positive (a sample at background has only a minimum age).");
        if (f14cError < 0) throw new ArgumentOutOfRangeException(nameof(f14cError), f14cError, "An error cannot be negative.");
        return (RadiocarbonAge.FromF14C(f14c), LibbyMeanLife * f14cError / f14c);
    }

    /// <summary>F14C = exp(-CRA / 8033), sigma_F = F sigma_CRA / 8033 (inverse of <see cref="AgeFromF14C"/>).</summary>
    public static (double F14C, double Error) F14CFromAge(RadiocarbonAge age, double ageError)
    {
        if (ageError < 0) throw new ArgumentOutOfRangeException(nameof(ageError), ageError, "An error cannot be negative.");
        double f = age.F14C;
        return (f, f * ageError / LibbyMeanLife);
    }

    /// <summary>
    /// Activity normalised to d13C = -25 permil VPDB. The ratio form A [0.975 / (1 + d13C/1000)]^2 is the
    /// default; <paramref name="approximate"/> gives the linear form A [1 - 2 (25 + d13C)/1000]
    /// (Stuiver and Polach 1977).
    /// </summary>
    public static double NormaliseTo25Permil(double activity, double d13CPermil, bool approximate = false)
    {
        if (approximate) return activity * (1 - 2 * (25 + d13CPermil) / 1000.0);
        double r = 0.975 / (1 + d13CPermil / 1000.0);
        return activity * r * r;
    }

    /// <summary>pMC = 100 F14C (100 pMC is the 1950 atmosphere).</summary>
    public static double PercentModern(double f14c) => 100.0 * f14c;

    public static double F14CFromPercentModern(double pmc) => pmc / 100.0;

    /// <summary>D14C = (F14C - 1) 1000, permil: no decay correction for the year of growth.</summary>
    public static double SmallDelta14C(double f14c) => (f14c - 1) * 1000.0;

    /// <summary>Delta14C = [F14C exp((1950 - y)/8267) - 1] 1000, permil, for a sample formed in year <paramref name="yearCE"/>.</summary>
    public static double Delta14C(double f14c, double yearCE) =>
        (f14c * Math.Exp((CalendarAge.ReferenceYearCE - yearCE) / CambridgeMeanLife) - 1) * 1000.0;

    /// <summary>Delta14C of a calibration curve row: 1000 [exp(theta/8267 - r/8033) - 1] for calendar age theta and 14C age r.</summary>
    public static double Delta14C(CalendarAge calendarAge, RadiocarbonAge c14Age) =>
        (Math.Exp(calendarAge.YearsBP / CambridgeMeanLife - c14Age.Years / LibbyMeanLife) - 1) * 1000.0;
}
