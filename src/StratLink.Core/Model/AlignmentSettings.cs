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
}

public sealed record SignalWeight(string Signal, double Weight);

public static class AlignmentMethods
{
    public const string Dtw = "dtw";
    public const string Ties = "ties";
    public static readonly IReadOnlyList<string> All = [Dtw, Ties];
}
