using System.Collections.Immutable;

namespace StratLink.Model;

/// <summary>
/// A dated record (a stack, or a master core given as signal against age) that cores are aligned to,
/// their transferred ages joining the project's age controls (project file section <c>target</c>).
/// </summary>
public sealed record DatedTargetSpec
{
    /// <summary>Path to the target's table, relative to the project file.</summary>
    public required string Table { get; init; }

    /// <summary>Column of ages, ascending; read in <see cref="AgeUnit"/>.</summary>
    public string AgeColumn { get; init; } = "age";

    /// <summary><c>yr</c> or <c>ka</c>, both cal BP.</summary>
    public string AgeUnit { get; init; } = DatedTargetAgeUnits.Years;

    /// <summary>The signal shared by the cores and the target (the cores' signal name).</summary>
    public required string Signal { get; init; }

    /// <summary>Target column to signal name, as for cores (e.g. <c>"Benthic d18O (per mil)": d18o</c>).</summary>
    public ImmutableDictionary<string, string> Columns { get; init; } = ImmutableDictionary<string, string>.Empty;

    public int? HeaderLine { get; init; }

    /// <summary>1 sigma of the target's ages, years; null: from <see cref="AgeErrorColumn"/>, else 0.</summary>
    public double? AgeError { get; init; }

    /// <summary>Column of the target's 1-sigma age error, in <see cref="AgeUnit"/>.</summary>
    public string? AgeErrorColumn { get; init; }

    /// <summary>Cores dated by the target; empty: the reference core.</summary>
    public ImmutableList<string> Cores { get; init; } = [];

    /// <summary>Core-depth step between transferred age controls, project depth unit; null: a core's sampled length / <see cref="DefaultControlsPerCore"/>.</summary>
    public double? Spacing { get; init; }

    /// <summary>Youngest and oldest target age the cores span, in <see cref="AgeUnit"/>; null: the whole target.</summary>
    public (double Young, double Old)? AgeSpan { get; init; }

    /// <summary>
    /// Transferred controls per core without a spacing: dense enough to follow rate changes on the scale of the
    /// alignment window, sparse enough that neighbours rarely overlap within their errors (a choice of this program).
    /// </summary>
    public const int DefaultControlsPerCore = 50;

    /// <summary>Years per unit of <see cref="AgeUnit"/>.</summary>
    public double YearsPerUnit => AgeUnit == DatedTargetAgeUnits.Kiloyears ? 1000 : 1;
}

public static class DatedTargetAgeUnits
{
    public const string Years = "yr";
    public const string Kiloyears = "ka";
    public static readonly IReadOnlyList<string> All = [Years, Kiloyears];
}
