using StratLink.AgeModelling;
using StratLink.Alignment;
using StratLink.Workflows;

namespace StratLink.Checks;

/// <summary>
/// What the consistency checks may call on besides the project: the aligner (for the leave-one-out and
/// loop-closure checks, run on edited copies of the project) and a finished age model. Both are optional:
/// without the aligner those checks are skipped with a <see cref="CheckCodes.CheckNotRun"/> note, so the
/// user knows they did not run; without the age model the controls are not compared with it.
/// </summary>
public sealed record CheckContext
{
    /// <summary>Aligns every core of a project to its reference core (the project's own alignment settings).</summary>
    public Func<LoadedProject, CancellationToken, AlignmentResult>? Aligner { get; init; }

    /// <summary>The finished age model on composite depth (needs the alignment too).</summary>
    public ICompositeAgeScale? AgeScale { get; init; }

    public IProgress<WorkProgress>? Progress { get; init; }
}
