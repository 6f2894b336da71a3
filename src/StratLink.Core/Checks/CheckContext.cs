using StratLink.AgeModelling;
using StratLink.Alignment;
using StratLink.Model;
using StratLink.Quantities;
using StratLink.Workflows;

namespace StratLink.Checks;

/// <summary>
/// What the consistency checks may call on besides the project: the aligner (for the leave-one-out and
/// loop-closure checks, run on edited copies of the project), calibration and varve chronologies from
/// the age modelling, and a finished age model. Every member is optional: a check that lacks what it
/// needs is skipped with a <see cref="CheckCodes.CheckNotRun"/> note, so the user knows it did not run.
/// </summary>
public sealed record CheckContext
{
    /// <summary>Aligns every core of a project to its reference core (the project's own alignment settings).</summary>
    public Func<LoadedProject, CancellationToken, AlignmentResult>? Aligner { get; init; }

    /// <summary>
    /// The 14C range of a calibration curve file (absolute path), or null when the file cannot be read.
    /// Null member = <see cref="CurveRangeReader.Read"/>.
    /// </summary>
    public Func<string, RadiocarbonRange?>? CurveRange { get; init; }

    /// <summary>A radiocarbon control calibrated to calendar years, or null when it cannot be calibrated.</summary>
    public Func<RadiocarbonAgeControl, AgeEstimate?>? Calibrate { get; init; }

    /// <summary>The age a varve count gives at a depth of its core with its error, or null outside the counted interval.</summary>
    public Func<VarveCountControl, CoreDepth, AgeEstimate?>? VarveAge { get; init; }

    /// <summary>The finished age model on composite depth (needs the alignment too).</summary>
    public ICompositeAgeScale? AgeScale { get; init; }

    public IProgress<WorkProgress>? Progress { get; init; }
}
