namespace StratLink.Analysis;

/// <summary>
/// A shift of the median-age run and its age across the age-model members: members' shifts matched by the
/// nearest age within <see cref="MatchWindowYears"/>; 2.5-97.5 % range of the matched ages and the share of
/// members with a match.
/// </summary>
public sealed record ShiftSpread(RegimeShift Shift, double AgeLoBP, double AgeHiBP, double ShareMatched, double MatchWindowYears);
