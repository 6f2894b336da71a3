namespace StratLink.Analysis;

/// <summary>
/// A period asked for, tested in the spectrum within half the resolution bandwidth of 1/period: the largest
/// power-to-95 %-level ratio of the median-age run and the share of age-model members above their own 95 % level.
/// </summary>
public sealed record PeriodCheck(double PeriodYears, double PeakPeriodYears, double PowerOverLevel95, double? ShareOfMembersAbove95)
{
    public bool Above95 => PowerOverLevel95 > 1;
}
