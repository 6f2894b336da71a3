namespace StratLink.Model;

/// <summary>Thresholds of the consistency checks.</summary>
public sealed record CheckSettings
{
    /// <summary>Largest accepted jump of the tie-implied accumulation-rate ratio between consecutive ties (common practice: 4).</summary>
    public double RateJumpFactor { get; init; } = DefaultRateJumpFactor;

    public const double DefaultRateJumpFactor = 4.0;

    /// <summary>A tie the signals place more than this many tie uncertainties away is reported.</summary>
    public double TieMisfitSigmas { get; init; } = 3.0;
}
