namespace StratLink.Workflows;

/// <summary>
/// Maps one stage's progress (0..1) onto its share of the whole run. Synchronous, unlike
/// <see cref="Progress{T}"/>, so reports arrive in order and nothing is posted to a thread pool.
/// </summary>
public sealed class ScaledProgress(IProgress<WorkProgress> target, string stage, double start, double share) : IProgress<WorkProgress>
{
    public void Report(WorkProgress value) =>
        target.Report(new WorkProgress(stage, start + share * Math.Clamp(value.Fraction, 0, 1), value.Detail ?? value.Stage));
}
