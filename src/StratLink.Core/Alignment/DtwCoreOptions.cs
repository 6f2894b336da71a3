using StratLink.Model;

namespace StratLink.Alignment;

/// <summary>Settings of one core-to-reference DTW alignment (from the project's alignment section).</summary>
public sealed record DtwCoreOptions
{
    public StepPattern Pattern { get; init; } = StepPattern.Symmetric2;

    /// <summary>Band half-width as a fraction of the longer core, laid around the straight-line-ties mapping.</summary>
    public double Window { get; init; } = 0.15;

    /// <summary>Number of sampled paths; 0 = the optimal path only.</summary>
    public int Ensemble { get; init; } = 200;

    /// <summary>Free start in the reference (lost top); null = auto: open when the ties place the core's top more than 1% of the reference below its top.</summary>
    public bool? OpenBegin { get; init; }

    /// <summary>Free end in the reference; null = auto, as for <see cref="OpenBegin"/>.</summary>
    public bool? OpenEnd { get; init; }
    public double RatePenalty { get; init; }
    public int Seed { get; init; } = 42;

    /// <summary>Signals are standardised robustly (median, MAD) rather than by mean and SD; used when both are rescaled over their overlap.</summary>
    public bool RobustStandardise { get; init; }

    public static DtwCoreOptions From(AlignmentSettings s, int seed) => new()
    {
        Pattern = StepPattern.Parse(s.Pattern),
        Window = s.Window,
        Ensemble = s.Ensemble,
        OpenBegin = s.OpenBegin,
        OpenEnd = s.OpenEnd,
        RatePenalty = s.RatePenalty,
        Seed = seed,
        RobustStandardise = s.Standardise == StandardiseMethods.Robust,
    };
}
