namespace StratLink.Analysis;

/// <summary>Settings of the sequential t-test for regime shifts (Rodionov 2004); defaults are common practice (l = 10, p = 0.1, h = 1).</summary>
public sealed record RegimeShiftOptions
{
    /// <summary>
    /// Cut-off length, years, for multi-centennial to millennial records sampled every few years (the command
    /// line's default). Regimes shorter than l are not sought, and a cycle whose half period approaches l shows up
    /// as alternating "regimes": on the demo site (2-yr spacing, cycles of 11 and 88 yr) l = 10 samples reported a
    /// shift every ~20 yr. 150 yr is about twice the longest centennial cycle commonly sought (88 yr), so each
    /// regime mean averages over more than one of its periods (common practice: choose l above the time scales to
    /// be ignored; Rodionov 2004).
    /// </summary>
    public const double LongRecordCutoffYears = 150;

    /// <summary>Target probability for long records: the usual 5 % level rather than the 10 % of annual series.</summary>
    public const double LongRecordProbability = 0.05;

    /// <summary>Huber parameter for long records: h = 2, which Rodionov's method notes for the test call typical.</summary>
    public const double LongRecordHuber = 2;

    /// <summary>Cut-off length l in samples: regimes shorter than this are not sought.</summary>
    public int CutoffLength { get; init; } = 10;

    /// <summary>Target probability p of the two-tailed t-test.</summary>
    public double Probability { get; init; } = 0.1;

    /// <summary>Huber parameter h, in standard deviations; deviations beyond it get weight h/|x*|. Infinity = unweighted (Rodionov 2004).</summary>
    public double HuberParameter { get; init; } = 1;
}
