using StratLink.Checks;

namespace StratLink.Analysis;

/// <summary>Everything <see cref="RecordAnalysis.Run"/> found for one record, on its median ages, plus the ensemble spread.</summary>
public sealed record AnalysisResult
{
    public required string SignalName { get; init; }
    public string? ValueUnit { get; init; }
    public required AnalysisOptions Options { get; init; }

    /// <summary>The record on its median ages, oldest first.</summary>
    public required AgeSeries Series { get; init; }

    public required SpectrumEstimate Spectrum { get; init; }
    public required RegimeShiftResult Regimes { get; init; }
    public required FilteredRecord Filtered { get; init; }
    public required IReadOnlyList<PeriodCheck> Periods { get; init; }

    /// <summary>Null when the record has no age ensemble.</summary>
    public EnsembleSpread? Ensemble { get; init; }

    /// <summary>Notes and warnings (dropped samples, clamped persistence).</summary>
    public required FindingList Findings { get; init; }
}
