namespace StratLink.Cli.Dashboard.Results;

/// <summary>
/// One age control as the age model used it: its age (calibrated for radiocarbon) with the 95 % envelope drawn
/// as its error bar, the 95 % ranges as text (several for a calibrated date), and any flags (out of order, excluded, unusable);
/// then the posterior: its modelled 95 % range and its posterior outlier share (NaN where not assessed).
/// </summary>
public sealed record ControlOutcome(string Id, double? CompositeDepth, double AgeMedianBP, double AgeLoBP, double AgeHiBP, string Flags,
    string? Ranges95 = null, string? Posterior95 = null, double OutlierShare = double.NaN);
