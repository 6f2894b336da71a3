using StratLink.Workflows;

namespace StratLink.Compositing;

/// <summary>
/// Carries every core's signals onto the composite grid through each member of its alignment
/// ensemble and pools them per row. Rows are processed in blocks, in parallel: each block writes
/// only its own rows and nothing is random, so results do not depend on scheduling.
/// </summary>
internal static class Stacker
{
    private const int BlockRows = 256;

    public static StackedRecord[] Stack(CompositeGrid grid, IReadOnlyList<CompositeCore> cores, IReadOnlyList<string> signals, Splice splice,
        bool standardised, IProgress<WorkProgress>? progress, CancellationToken ct)
    {
        int rows = grid.Count, nc = cores.Count, ns = signals.Count;
        // Every core is replicated to the same number of pooled values, so each weighs the same.
        int pool = cores.Count == 0 ? 1 : cores.Max(c => c.Mappings.Count);
        var coreIndex = cores.Select((c, i) => (c.Id, i)).ToDictionary(x => x.Id, x => x.i, StringComparer.Ordinal);
        var spliceCore = new int[rows];
        for (int r = 0; r < rows; r++) spliceCore[r] = splice.SourceByRow[r] is { } id && coreIndex.TryGetValue(id, out int ci) ? ci : -1;

        var mean = new double[ns][];
        var lo = new double[ns][];
        var hi = new double[ns][];
        var n = new int[ns][];
        var spliced = new double[ns][];
        for (int s = 0; s < ns; s++)
        {
            mean[s] = new double[rows];
            lo[s] = new double[rows];
            hi[s] = new double[rows];
            n[s] = new int[rows];
            spliced[s] = new double[rows];
        }
        // Per core, the signals it has (index into signals) and their samples.
        var coreSignals = cores.Select(c => Enumerable.Range(0, ns).Where(s => c.Samples.ContainsKey(signals[s])).ToArray()).ToArray();

        int blocks = (rows + BlockRows - 1) / BlockRows;
        int done = 0;
        var options = new ParallelOptions { CancellationToken = ct };
        Parallel.For(0, blocks, options, () => new Workspace(cores, coreSignals, pool), (b, _, ws) =>
        {
            int r0 = b * BlockRows, len = Math.Min(BlockRows, rows - r0);
            var z = grid.Values.Slice(r0, len);
            for (int c = 0; c < nc; c++)
            {
                var core = cores[c];
                for (int m = 0; m <= core.Mappings.Count; m++)
                {
                    // The last pass is the median mapping, for the spliced value.
                    var mapping = m < core.Mappings.Count ? core.Mappings[m] : core.Ensemble.Median;
                    PiecewiseLinearSweep.EvaluateAscending(mapping.CompositeKnots, mapping.CoreKnots, z, ws.Depths.AsSpan(0, len));
                    for (int j = 0; j < coreSignals[c].Length; j++)
                    {
                        var samples = core.Samples[signals[coreSignals[c][j]]];
                        var target = m < core.Mappings.Count ? ws.Values[c][j].AsSpan(m * BlockRows, len) : ws.Median[c][j].AsSpan(0, len);
                        samples.SampleAscending(ws.Depths.AsSpan(0, len), target, core.Unusable);
                    }
                }
            }
            for (int s = 0; s < ns; s++)
                for (int k = 0; k < len; k++)
                    Pool(ws, cores, coreSignals, s, k, r0 + k, spliceCore[r0 + k], pool, mean[s], lo[s], hi[s], n[s], spliced[s]);
            int finished = Interlocked.Increment(ref done);
            progress?.Report(new WorkProgress("composite: stacking", (double)finished / blocks));
            return ws;
        }, _ => { });

        return [.. Enumerable.Range(0, ns).Select(s => new StackedRecord(signals[s], standardised, mean[s], lo[s], hi[s], n[s], spliced[s]))];
    }

    private static void Pool(Workspace ws, IReadOnlyList<CompositeCore> cores, int[][] coreSignals, int s, int k, int row, int spliceCore,
        int pool, double[] mean, double[] lo, double[] hi, int[] n, double[] spliced)
    {
        int filled = 0, present = 0;
        double sumOfMeans = 0;
        spliced[row] = double.NaN;
        for (int c = 0; c < cores.Count; c++)
        {
            int j = Array.IndexOf(coreSignals[c], s);
            if (j < 0) continue;
            if (c == spliceCore) spliced[row] = ws.Median[c][j][k];
            int members = cores[c].Mappings.Count;
            var values = ws.Values[c][j];
            int valid = 0;
            double sum = 0;
            for (int m = 0; m < members; m++)
            {
                double v = values[m * BlockRows + k];
                if (double.IsNaN(v)) continue;
                ws.Valid[valid++] = v;
                sum += v;
            }
            // A core is present where at least half of its alignments give it a value.
            if (valid == 0 || 2 * valid < members) continue;
            present++;
            sumOfMeans += sum / valid;
            for (int p = 0; p < pool; p++) ws.Pool[filled++] = ws.Valid[p % valid];
        }
        n[row] = present;
        if (present == 0)
        {
            mean[row] = lo[row] = hi[row] = double.NaN;
            return;
        }
        mean[row] = sumOfMeans / present;
        var span = ws.Pool.AsSpan(0, filled);
        lo[row] = OrderStatistics.PercentileInPlace(span, 2.5);
        hi[row] = OrderStatistics.PercentileInPlace(span, 97.5);
    }

    /// <summary>Buffers of one worker: mapped depths of a block, values per core, signal and member, and the pool of one row.</summary>
    private sealed class Workspace
    {
        public Workspace(IReadOnlyList<CompositeCore> cores, int[][] coreSignals, int pool)
        {
            Depths = new double[BlockRows];
            Values = new double[cores.Count][][];
            Median = new double[cores.Count][][];
            for (int c = 0; c < cores.Count; c++)
            {
                Values[c] = new double[coreSignals[c].Length][];
                Median[c] = new double[coreSignals[c].Length][];
                for (int j = 0; j < coreSignals[c].Length; j++)
                {
                    Values[c][j] = new double[cores[c].Mappings.Count * BlockRows];
                    Median[c][j] = new double[BlockRows];
                }
            }
            Valid = new double[pool];
            Pool = new double[Math.Max(1, cores.Count) * pool];
        }

        public double[] Depths { get; }
        public double[][][] Values { get; }
        public double[][][] Median { get; }
        public double[] Valid { get; }
        public double[] Pool { get; }
    }
}
