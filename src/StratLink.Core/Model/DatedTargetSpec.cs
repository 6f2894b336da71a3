using System.Collections.Immutable;

namespace StratLink.Model;

/// <summary>
/// A dated record that cores are aligned to, their transferred ages joining the project's age controls
/// (project file section <c>target</c>): a stack or a master core given as signal against age, or a
/// master core given as signal against depth with its own age model (<see cref="AgeModel"/>).
/// </summary>
public sealed record DatedTargetSpec
{
    /// <summary>Path to the target's table, relative to the project file.</summary>
    public required string Table { get; init; }

    /// <summary>Column of ages, ascending; read in <see cref="AgeUnit"/>.</summary>
    public string AgeColumn { get; init; } = "age";

    /// <summary>Column of depths when the table is signal against depth (then <see cref="AgeModel"/> dates it); null: the table is on age.</summary>
    public string? DepthColumn { get; init; }

    /// <summary>The master core's age model, depth to age, when the table is on depth.</summary>
    public DatedTargetAgeModel? AgeModel { get; init; }

    /// <summary>What to do with rows that repeat the table's depth or age (replicate analyses), as for cores.</summary>
    public RepeatedDepths RepeatedDepths { get; init; } = RepeatedDepths.Error;

    /// <summary><c>yr</c>, <c>ka</c> or <c>Ma</c>, all cal BP; the unit of the target's ages and of its age model's.</summary>
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
    public double YearsPerUnit => AgeUnit switch { DatedTargetAgeUnits.Kiloyears => 1e3, DatedTargetAgeUnits.Megayears => 1e6, _ => 1 };
}

/// <summary>
/// A dated master core's own age model: a table of depths (in the unit of the target's table) and ages
/// in the target's age unit, ages increasing with depth; linear between its rows.
/// </summary>
public sealed record DatedTargetAgeModel
{
    public required string Table { get; init; }
    public string DepthColumn { get; init; } = "depth";
    public string AgeColumn { get; init; } = "age";

    /// <summary>Column of the ages' 1-sigma error, in the target's age unit.</summary>
    public string? ErrorColumn { get; init; }

    public int? HeaderLine { get; init; }
}

public static class DatedTargetAgeUnits
{
    public const string Years = "yr";
    public const string Kiloyears = "ka";
    public const string Megayears = "Ma";
    public static readonly IReadOnlyList<string> All = [Years, Kiloyears, Megayears];
}
