namespace StratLink.Analysis;

/// <summary>
/// One Gaussian filter's output and response. Low-pass: <see cref="CentrePeriodYears"/> is infinite, the
/// half-power band runs from <see cref="HalfPowerShortPeriodYears"/> to infinity. Band-pass: the half-power band
/// is [short, long] around the centre (long infinite when the band reaches zero frequency).
/// </summary>
public sealed record GaussianFilterBand(
    double CentrePeriodYears,
    double SigmaYears,
    double HalfPowerShortPeriodYears,
    double HalfPowerLongPeriodYears,
    double[] Values);
