using StratLink.AgeModelling;
using StratLink.Alignment;
using StratLink.Checks;
using StratLink.Compositing;

namespace StratLink.Workflows;

/// <summary>Everything one build made from one project snapshot.</summary>
public sealed record BuildResult(
    LoadedProject Project,
    AlignmentResult Alignment,
    AgeModelResult Ages,
    CompositeResult Composite,
    IReadOnlyList<Finding> Findings)
{
    /// <summary>The method of each stage, for run.json.</summary>
    public IReadOnlyDictionary<string, string> Methods => new SortedDictionary<string, string>(StringComparer.Ordinal)
    {
        ["alignment"] = Alignment.Method + (Alignment.Seed is int s ? $" (ensemble seed {s})" : ""),
        ["age_model"] = $"Monte Carlo, {Ages.MemberCount} members, {Project.Project.AgeModel.Interpolation} interpolation, seed {Ages.Seed}",
        ["composite"] = Composite.MethodSummary,
    };

    public bool HasErrors => Findings.Any(f => f.Severity == Severity.Error);
}
