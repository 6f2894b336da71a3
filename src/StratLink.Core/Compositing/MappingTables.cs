using StratLink.Alignment;

namespace StratLink.Compositing;

/// <summary>Builds <see cref="CoreMappingTable"/>s: each ensemble member swept once over the core's sample depths.</summary>
internal static class MappingTables
{
    private const int BlockSamples = 1024;

    public static CoreMappingTable Build(CompositeCore core, CancellationToken ct)
    {
        double[] depths = core.Table.Depths;
        int n = depths.Length;
        var median = new double[n];
        var mapping = core.Ensemble.Median;
        PiecewiseLinearSweep.EvaluateAscending(mapping.CoreKnots, mapping.CompositeKnots, depths, median);
        var members = core.Ensemble.Members;
        if (members.Count == 0) return new CoreMappingTable(core.Id, mapping.Unit, depths, median, (double[])median.Clone(), (double[])median.Clone());

        var lo = new double[n];
        var hi = new double[n];
        // Blocks of samples keep the member-by-sample matrix small while each member is still swept linearly.
        var block = new double[members.Count * BlockSamples];
        var column = new double[members.Count];
        for (int start = 0; start < n; start += BlockSamples)
        {
            ct.ThrowIfCancellationRequested();
            int len = Math.Min(BlockSamples, n - start);
            var xs = depths.AsSpan(start, len);
            for (int m = 0; m < members.Count; m++)
                PiecewiseLinearSweep.EvaluateAscending(members[m].CoreKnots, members[m].CompositeKnots, xs, block.AsSpan(m * BlockSamples, len));
            for (int k = 0; k < len; k++)
            {
                for (int m = 0; m < members.Count; m++) column[m] = block[m * BlockSamples + k];
                lo[start + k] = OrderStatistics.PercentileInPlace(column, 2.5);
                hi[start + k] = OrderStatistics.PercentileInPlace(column, 97.5);
            }
        }
        return new CoreMappingTable(core.Id, mapping.Unit, depths, median, lo, hi);
    }

    /// <summary>Width (hi - lo) of the composite-depth band at the sample nearest each of the ascending core depths.</summary>
    public static void BandWidthAscending(CoreMappingTable table, ReadOnlySpan<double> coreDepths, Span<double> result)
    {
        var d = table.CoreDepths;
        int i = 0;
        for (int k = 0; k < coreDepths.Length; k++)
        {
            double x = coreDepths[k];
            while (i < d.Count - 1 && Math.Abs(d[i + 1] - x) <= Math.Abs(d[i] - x)) i++;
            result[k] = d.Count == 0 ? double.NaN : table.Hi[i] - table.Lo[i];
        }
    }

    /// <summary>Median mapping evaluated at ascending composite depths: the core depth of each.</summary>
    public static void CoreDepthsAscending(DepthMapping mapping, ReadOnlySpan<double> compositeDepths, Span<double> result) =>
        PiecewiseLinearSweep.EvaluateAscending(mapping.CompositeKnots, mapping.CoreKnots, compositeDepths, result);
}
