namespace StratLink.Alignment;

/// <summary>Switches of one dynamic time warping run.</summary>
public sealed record DtwOptions
{
    /// <summary>The query's first row may match any reference column (a core with a lost top); needs N normalisation.</summary>
    public bool OpenBegin { get; init; }

    /// <summary>The query's last row may match any reference column; needs a normalisable pattern.</summary>
    public bool OpenEnd { get; init; }

    /// <summary>Also keep the intermediate cells of multi-step productions inside the band (the R package checks only origins and arrivals).</summary>
    public bool StrictBand { get; init; }

    /// <summary>
    /// Cost added when a step changes the implied accumulation-rate ratio, per 45 degrees of change
    /// in step direction, against the best path into the origin cell; 0 = plain DTW.
    /// </summary>
    public double RatePenalty { get; init; }

    /// <summary>
    /// When set, open ends are scored by completion instead of normalisation: every reference column
    /// left unmatched before the start or after the end costs this much, so a path is neither drawn
    /// to match less of the reference nor refused for a pattern without a normaliser. Null = the R
    /// package dtw's rules (normalised open end, open begin only for N-normalised patterns).
    /// </summary>
    public double? CompletionCostPerColumn { get; init; }

    public static readonly DtwOptions Default = new();
}
