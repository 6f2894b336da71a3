namespace StratLink.Alignment;

/// <summary>
/// Result of a direct two-series alignment: distances and the path as 1-based (index_a, index_b)
/// of every lattice cell visited, the convention of the R package dtw (index1, index2).
/// </summary>
public sealed class PairResult
{
    internal PairResult(DtwPath path, StepPattern pattern)
    {
        Pattern = pattern;
        Distance = path.Distance;
        NormalisedDistance = double.IsNaN(path.NormalisedDistance) ? null : path.NormalisedDistance;
        IndexA = OneBased(path.I);
        IndexB = OneBased(path.J);
        StepEndsA = OneBased(path.StepEndsI);
        StepEndsB = OneBased(path.StepEndsJ);
        EndIndexB = path.EndColumn + 1;
    }

    public StepPattern Pattern { get; }

    /// <summary>Accumulated cost along the path (unnormalised).</summary>
    public double Distance { get; }

    /// <summary>Distance over the pattern's normaliser (N or N + M); null for symmetric1.</summary>
    public double? NormalisedDistance { get; }

    /// <summary>1-based row of series A of every cell on the path.</summary>
    public int[] IndexA { get; }

    /// <summary>1-based row of series B of every cell on the path.</summary>
    public int[] IndexB { get; }

    /// <summary>Like <see cref="IndexA"/> but only the end points of the steps taken (differs for multi-step patterns).</summary>
    public int[] StepEndsA { get; }

    public int[] StepEndsB { get; }

    /// <summary>1-based row of B matched by A's last row (less than B's length under open end).</summary>
    public int EndIndexB { get; }

    private static int[] OneBased(int[] zeroBased)
    {
        var r = new int[zeroBased.Length];
        for (int k = 0; k < r.Length; k++) r[k] = zeroBased[k] + 1;
        return r;
    }
}
