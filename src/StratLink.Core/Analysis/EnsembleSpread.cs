namespace StratLink.Analysis;

/// <summary>
/// How the results hold across age-model members: at each frequency of the spectrum the share of members whose
/// power exceeds their own chi-square 95 % level, and the age range of each shift.
/// </summary>
public sealed record EnsembleSpread(int[] Members, double[] ShareAbove95, IReadOnlyList<ShiftSpread> Shifts);
