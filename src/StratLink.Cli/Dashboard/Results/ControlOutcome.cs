namespace StratLink.Cli.Dashboard.Results;

/// <summary>One age control as the age model used it: calibrated 95 % range and any flags (outlier, out of curve, ...).</summary>
public sealed record ControlOutcome(string Id, double? CompositeDepth, double AgeMedianBP, double AgeLoBP, double AgeHiBP, string Flags);
