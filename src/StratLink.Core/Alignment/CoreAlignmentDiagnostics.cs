namespace StratLink.Alignment;

/// <summary>What one core's alignment did, for run.json, logs and the dashboard.</summary>
public sealed record CoreAlignmentDiagnostics
{
    public required string CoreId { get; init; }

    /// <summary><c>dtw</c>, <c>ties</c> or <c>identity</c> (the method actually used for this core).</summary>
    public required string Method { get; init; }

    public int Ties { get; init; }

    /// <summary>Independent lattice segments (between exact ties) solved.</summary>
    public int Segments { get; init; }

    /// <summary>Lattice cells inside the band over all segments.</summary>
    public long BandCells { get; init; }

    /// <summary>Accumulated cost of the optimal path (sum over segments).</summary>
    public double Distance { get; init; }

    /// <summary>Mean weighted local cost per path cell of the optimal path.</summary>
    public double MeanCost { get; init; }

    /// <summary>Integrated autocorrelation time of the local costs along the optimal path (cells).</summary>
    public double AutocorrelationCells { get; init; }

    /// <summary>Temperature of the path posterior: <see cref="MeanCost"/> x <see cref="AutocorrelationCells"/>.</summary>
    public double Temperature { get; init; }

    public int Seed { get; init; }

    /// <summary>Whether the core's start and end were free in the reference (after resolving auto).</summary>
    public bool OpenBegin { get; init; }

    public bool OpenEnd { get; init; }

    /// <summary>Rounds of alignment to the stack of the other cores (0 = aligned to the reference only).</summary>
    public int SiteRounds { get; init; }

    /// <summary>The optimal (least-cost) mapping; the ensemble's median is the one reported.</summary>
    public DepthMapping? Optimal { get; init; }
}
