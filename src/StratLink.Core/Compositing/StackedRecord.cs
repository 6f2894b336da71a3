namespace StratLink.Compositing;

/// <summary>
/// One signal stacked on the composite grid from every core and every member of each core's
/// alignment ensemble. All arrays have one value per grid row; NaN where no core has a value.
/// </summary>
/// <remarks>
/// Each core present at a row weighs the same. <see cref="Mean"/> is the mean over the present cores of
/// each core's mean over its ensemble members; <see cref="Lo"/> and <see cref="Hi"/> are the 2.5 and
/// 97.5 percentiles (Hyndman and Fan 1996 type 7) of the pooled values of all present cores and their
/// members. Where only one core is present (<see cref="N"/> = 1) the band is that core's alignment
/// spread alone, and equals the mean when its alignment has no ensemble: it then says nothing about
/// how well cores agree, which is what N = 1 flags.
/// </remarks>
public sealed class StackedRecord
{
    public StackedRecord(string signal, bool standardised, double[] mean, double[] lo, double[] hi, int[] n, double[] spliced)
    {
        Signal = signal;
        Standardised = standardised;
        Mean = mean;
        Lo = lo;
        Hi = hi;
        N = n;
        Spliced = spliced;
    }

    public string Signal { get; }

    /// <summary>True when values are z-scores per core (mean 0, SD 1 over each core's usable samples); false when in the signal's own units.</summary>
    public bool Standardised { get; }

    public IReadOnlyList<double> Mean { get; }
    public IReadOnlyList<double> Lo { get; }
    public IReadOnlyList<double> Hi { get; }

    /// <summary>Number of cores with a value at the row (a core counts when at least half of its ensemble members give one).</summary>
    public IReadOnlyList<int> N { get; }

    /// <summary>The splice's core at the row, carried by its median mapping; NaN where that core has no value or lacks the signal.</summary>
    public IReadOnlyList<double> Spliced { get; }
}
