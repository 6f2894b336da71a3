namespace StratLink.Cli.Dashboard.Results;

/// <summary>The stacked composite records, the splice, and what the record analysis said about them.</summary>
public sealed record CompositeRecords(
    IReadOnlyList<CompositeSignal> Signals,
    IReadOnlyList<SpliceSegment> Splice,
    IReadOnlyList<AnalysisNote> Analysis);
