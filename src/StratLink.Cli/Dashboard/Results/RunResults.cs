using StratLink.Alignment;
using StratLink.Checks;
using StratLink.Model;
using StratLink.Workflows;

namespace StratLink.Cli.Dashboard.Results;

/// <summary>
/// What one complete run produced, with the project snapshot it ran on: the results are current
/// while the project being edited is that same snapshot. Parts the build does not provide yet are null.
/// </summary>
public sealed record RunResults
{
    public required Project Project { get; init; }
    public required DateTimeOffset FinishedAt { get; init; }
    public AlignmentResult? Alignment { get; init; }
    public AgeCurve? Ages { get; init; }
    public IReadOnlyList<ControlOutcome> Controls { get; init; } = [];
    public CompositeRecords? Composite { get; init; }
    public IReadOnlyList<Finding>? Checks { get; init; }

    /// <summary>The library's build these results were read from, kept for export and for the record analysis; null for results made otherwise.</summary>
    public BuildResult? Build { get; init; }

    /// <summary>Stages that did not run, with the reason (shown instead of the missing part).</summary>
    public IReadOnlyList<string> Skipped { get; init; } = [];
}
