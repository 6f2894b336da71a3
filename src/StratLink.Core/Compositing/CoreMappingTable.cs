using StratLink.Quantities;

namespace StratLink.Compositing;

/// <summary>
/// Composite depth of every sample of one core: the median mapping and the 2.5/97.5 percentiles over
/// the alignment ensemble (equal to the median when the alignment gave no members).
/// </summary>
public sealed class CoreMappingTable
{
    public CoreMappingTable(string coreId, DepthUnit unit, double[] coreDepths, double[] median, double[] lo, double[] hi)
    {
        if (median.Length != coreDepths.Length || lo.Length != coreDepths.Length || hi.Length != coreDepths.Length)
            throw new ArgumentException($"Mapping table of core {coreId}: columns differ in length.");
        CoreId = coreId;
        Unit = unit;
        CoreDepths = coreDepths;
        Median = median;
        Lo = lo;
        Hi = hi;
    }

    public string CoreId { get; }
    public DepthUnit Unit { get; }

    /// <summary>Sample depths of the core, ascending, in <see cref="Unit"/>.</summary>
    public IReadOnlyList<double> CoreDepths { get; }

    /// <summary>Composite depth under the median mapping.</summary>
    public IReadOnlyList<double> Median { get; }

    /// <summary>2.5 percentile of composite depth over the ensemble (Hyndman and Fan 1996 type 7).</summary>
    public IReadOnlyList<double> Lo { get; }

    /// <summary>97.5 percentile of composite depth over the ensemble.</summary>
    public IReadOnlyList<double> Hi { get; }

    public int Count => CoreDepths.Count;
}
