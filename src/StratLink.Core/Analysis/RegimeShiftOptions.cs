namespace StratLink.Analysis;

/// <summary>Settings of the sequential t-test for regime shifts (Rodionov 2004); defaults are common practice (l = 10, p = 0.1, h = 1).</summary>
public sealed record RegimeShiftOptions
{
    /// <summary>Cut-off length l in samples: regimes shorter than this are not sought.</summary>
    public int CutoffLength { get; init; } = 10;

    /// <summary>Target probability p of the two-tailed t-test.</summary>
    public double Probability { get; init; } = 0.1;

    /// <summary>Huber parameter h, in standard deviations; deviations beyond it get weight h/|x*|. Infinity = unweighted (Rodionov 2004).</summary>
    public double HuberParameter { get; init; } = 1;
}
