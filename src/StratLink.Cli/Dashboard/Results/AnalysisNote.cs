namespace StratLink.Cli.Dashboard.Results;

/// <summary>
/// One statement of the record analysis (a regime shift at a depth, a spectral peak), drawn as a
/// mark on the composite when it has a depth and listed beside it in any case.
/// </summary>
public sealed record AnalysisNote(string Signal, double? CompositeDepth, string Text);
