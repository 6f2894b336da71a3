namespace StratLink.Cli.Dashboard.Results;

/// <summary>
/// One signal's composite on the composite depth grid (project unit, ascending) with its band;
/// <see cref="AgeMedianBP"/> is the age at each grid depth when an age model ran;
/// <see cref="Standardised"/> when the values are per-core z-scores rather than the signal's own units.
/// </summary>
public sealed record CompositeSignal(string Name, double[] CompositeDepth, double[] Mean, double[] Lo, double[] Hi, double[]? AgeMedianBP,
    bool Standardised = false);
