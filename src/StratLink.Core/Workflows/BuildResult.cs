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
    public IReadOnlyDictionary<string, string> Methods
    {
        get
        {
            var methods = new SortedDictionary<string, string>(StringComparer.Ordinal)
            {
                ["alignment"] = Alignment.Method + (Alignment.Seed is int s ? $" (ensemble seed {s})" : ""),
                ["age_model"] = $"Monte Carlo, {Ages.MemberCount} members, {Project.Project.AgeModel.Interpolation} interpolation, seed {Ages.Seed}",
                ["composite"] = Composite.MethodSummary,
            };
            if (Project.Project.Target is { } t)
                methods["target"] = $"dtw of {string.Join(", ", Project.Project.TargetCoreIds)} to {t.Table}{(t.AgeModel is { } am ? $" (on depth, dated by its age model {am.Table})" : "")} by {t.Signal} (ensemble seed {TargetAgeControls.Seed(Project.Project)} with each core's id); "
                    + $"transferred ages as age controls {TargetAgeControls.IdPrefix}CORE:DEPTH";
            return methods;
        }
    }

    public bool HasErrors => Findings.Any(f => f.Severity == Severity.Error);
}
