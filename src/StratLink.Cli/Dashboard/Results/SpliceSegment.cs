namespace StratLink.Cli.Dashboard.Results;

/// <summary>A splice interval: composite depths [From, To] are taken from core <see cref="Core"/>.</summary>
public sealed record SpliceSegment(string Core, double From, double To);
