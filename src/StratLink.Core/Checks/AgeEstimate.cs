namespace StratLink.Checks;

/// <summary>An age with a 1 sigma error, years cal BP: the form in which the age checks compare ages.</summary>
public readonly record struct AgeEstimate(double YearsBP, double Sigma)
{
    /// <summary>
    /// From a median and a 95 % range (e.g. a calibrated radiocarbon age): sigma = range width / 3.92,
    /// the normal-distribution equivalent (common practice; exact only for a normal distribution).
    /// </summary>
    public static AgeEstimate FromRange95(double medianBP, double loBP, double hiBP) => new(medianBP, Math.Abs(hiBP - loBP) / 3.92);
}
