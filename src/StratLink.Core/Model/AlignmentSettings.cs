using System.Collections.Immutable;

namespace StratLink.Model;

/// <summary>How cores are aligned to the reference core.</summary>
public sealed record AlignmentSettings
{
    /// <summary>Reference core id: composite depth is this core's depth scale. Null = the first core.</summary>
    public string? Reference { get; init; }

    /// <summary>Signals and their weights in the multi-signal cost; each is standardised per core.</summary>
    public ImmutableList<SignalWeight> Signals { get; init; } = [];

    /// <summary>Band half-width as a fraction of the longer core.</summary>
    public double Window { get; init; } = 0.15;

    /// <summary>Number of sampled alignments for the uncertainty bands.</summary>
    public int Ensemble { get; init; } = 200;

    /// <summary><c>dtw</c> (default) or <c>ties</c> (straight lines between marker ties).</summary>
    public string Method { get; init; } = AlignmentMethods.Dtw;

    /// <summary>DTW step pattern: symmetric1, symmetric2 (default), asymmetric, symmetricP1, rabinerJuang4c, typeIIIc.</summary>
    public string Pattern { get; init; } = "symmetric2";

    /// <summary>Grid step of the resampled signals in the project unit; null = the reference core's median spacing.</summary>
    public double? Step { get; init; }

    /// <summary>Per-core standardisation: <c>zscore</c> (mean, SD) or <c>robust</c> (median, 1.4826 MAD).</summary>
    public string Standardise { get; init; } = StandardiseMethods.ZScore;

    /// <summary>Align the first-derivative form of the signals (derivative DTW, Keogh and Pazzani 2001).</summary>
    public bool Derivative { get; init; }

    /// <summary>Remove a least-squares linear trend in depth from each signal before standardising.</summary>
    public bool Detrend { get; init; }

    /// <summary>Cost per 45 degrees of change in step direction (accumulation-rate change); 0 = plain DTW.</summary>
    public double RatePenalty { get; init; }

    /// <summary>
    /// A core's top may match anywhere in the reference (a lost top). Null = auto: open when the
    /// core's marker ties place its top clearly below the reference's top.
    /// </summary>
    public bool? OpenBegin { get; init; }

    /// <summary>A core's bottom may match anywhere in the reference. Null = auto, as for <see cref="OpenBegin"/>.</summary>
    public bool? OpenEnd { get; init; }

    /// <summary>Seed of the alignment ensemble; null = the age model's seed.</summary>
    public int? Seed { get; init; }

    /// <summary>
    /// <c>site</c> (default): with three or more cores aligned by dtw, every core is aligned again to the
    /// stack of all the others until the mappings settle, so all cores map onto one composite;
    /// <c>reference</c>: every core is aligned to the reference core only. With two cores both are the
    /// same. Either way composite depth is the reference's depth where it has data.
    /// </summary>
    public string Scale { get; init; } = AlignmentScales.Site;
}

public static class AlignmentScales
{
    public const string Site = "site";
    public const string Reference = "reference";
    public static readonly IReadOnlyList<string> All = [Site, Reference];
}

public static class StandardiseMethods
{
    public const string ZScore = "zscore";
    public const string Robust = "robust";
    public static readonly IReadOnlyList<string> All = [ZScore, Robust];
}

public sealed record SignalWeight(string Signal, double Weight);

public static class AlignmentMethods
{
    public const string Dtw = "dtw";
    public const string Ties = "ties";
    public static readonly IReadOnlyList<string> All = [Dtw, Ties];
}
