namespace StratLink.Alignment;

/// <summary>
/// The alignment of one core to the reference: the best (median) mapping and, where the method
/// samples them, the ensemble members whose spread gives the composite-depth uncertainty.
/// </summary>
public sealed class MappingEnsemble
{
    public MappingEnsemble(DepthMapping median, IReadOnlyList<DepthMapping> members)
    {
        Median = median;
        Members = members;
    }

    public string CoreId => Median.CoreId;
    public DepthMapping Median { get; }

    /// <summary>Sampled mappings; empty when the method gives one answer only.</summary>
    public IReadOnlyList<DepthMapping> Members { get; }

    /// <summary>The member for Monte Carlo iteration <paramref name="iteration"/> (cycling), or the median when there are none.</summary>
    public DepthMapping Member(int iteration) => Members.Count == 0 ? Median : Members[iteration % Members.Count];

    /// <summary>2.5 and 97.5 percentiles of composite depth at a core depth (both the median's value when there are no members).</summary>
    public (double Lo, double Hi) CompositeRange(double coreDepth)
    {
        if (Members.Count == 0)
        {
            double v = Median.ToCompositeValue(coreDepth);
            return (v, v);
        }
        var values = new double[Members.Count];
        for (int i = 0; i < values.Length; i++) values[i] = Members[i].ToCompositeValue(coreDepth);
        Array.Sort(values);
        return (Statistics.PercentileSorted(values, 2.5), Statistics.PercentileSorted(values, 97.5));
    }
}
