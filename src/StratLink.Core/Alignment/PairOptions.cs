namespace StratLink.Alignment;

/// <summary>Settings of a direct two-series alignment (the <c>pair</c> command).</summary>
public sealed record PairOptions
{
    public StepPattern Pattern { get; init; } = StepPattern.Symmetric2;

    /// <summary>Sakoe-Chiba window |j - i| &lt;= Window in samples (1-based, no slope correction); null = no window.</summary>
    public int? Window { get; init; }

    public bool OpenBegin { get; init; }
    public bool OpenEnd { get; init; }
}
