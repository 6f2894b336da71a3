using System.Collections.Immutable;
using StratLink.Checks;
using StratLink.Quantities;

namespace StratLink.AgeModelling;

/// <summary>
/// The Monte Carlo age model of a site on the composite depth scale: one age-depth curve per iteration
/// (each made with one member of every core's alignment ensemble), ages for every sample of every core and
/// for the composite grid, per-control summaries, and what the run had to say (findings).
/// </summary>
public sealed class AgeModelResult : ICompositeAgeScale
{
    internal AgeModelResult(int seed, AgeInterpolation interpolation, DepthUnit unit, IReadOnlyList<AgeDepthCurve> members,
        ImmutableArray<AgeControlSummary> controls, IReadOnlyDictionary<string, AgeSeries> cores, AgeSeries? composite,
        int orderForcedIterations, FindingList findings)
    {
        Seed = seed;
        Interpolation = interpolation;
        Unit = unit;
        Members = members;
        Controls = controls;
        Cores = cores;
        Composite = composite;
        OrderForcedIterations = orderForcedIterations;
        Findings = findings;
    }

    /// <summary>The seed every draw was derived from (record it with the outputs).</summary>
    public int Seed { get; }

    public AgeInterpolation Interpolation { get; }
    public DepthUnit Unit { get; }

    /// <summary>One age-depth curve per iteration; empty when the model could not be built (see <see cref="Findings"/>).</summary>
    public IReadOnlyList<AgeDepthCurve> Members { get; }

    /// <summary>Every age control of the project, used or not, in file order.</summary>
    public ImmutableArray<AgeControlSummary> Controls { get; }

    /// <summary>Core id to the ages of its samples (cores with a table and a mapping).</summary>
    public IReadOnlyDictionary<string, AgeSeries> Cores { get; }

    /// <summary>Ages on the composite grid (the composite step over the cores' composite span); null when the model could not be built.</summary>
    public AgeSeries? Composite { get; }

    /// <summary>Iterations in which no ordered draw was found and ages were pooled into order.</summary>
    public int OrderForcedIterations { get; }

    public FindingList Findings { get; }

    public bool IsBuilt => Members.Count > 0;

    public int MemberCount => Members.Count;

    /// <summary>The composite scale's event layers; member curves run on event-free composite depth.</summary>
    public EventFreeScale CompositeEvents { get; init; } = EventFreeScale.None;

    public double MemberAgeAt(int member, CompositeDepth depth) => Members[member].AgeAt(CompositeEvents.ToEventFree(depth.In(Unit)));

    public (double MedianBP, double LoBP, double HiBP) AgeAt(CompositeDepth depth)
    {
        if (Members.Count == 0) return (double.NaN, double.NaN, double.NaN);
        double z = CompositeEvents.ToEventFree(depth.In(Unit));
        var ages = new double[Members.Count];
        for (int i = 0; i < ages.Length; i++) ages[i] = Members[i].AgeAt(z);
        Array.Sort(ages);
        return (Statistics.PercentileSorted(ages, 50), Statistics.PercentileSorted(ages, 2.5), Statistics.PercentileSorted(ages, 97.5));
    }

    /// <summary>Rows per unit of parallel work in <see cref="AgesAt"/>.</summary>
    private const int RowBlock = 64;

    /// <summary>
    /// The values of <see cref="AgeAt"/>, to the bit, for many depths: each member curve is read along a block of
    /// ascending depths with its search carried on, and the six order statistics the three percentiles interpolate
    /// are selected instead of sorting every column. Blocks run in parallel and write only their own rows.
    /// </summary>
    public void AgesAt(ReadOnlySpan<CompositeDepth> depths, Span<double> medianBP, Span<double> loBP, Span<double> hiBP, CancellationToken ct)
    {
        int n = depths.Length, members = Members.Count;
        if (members == 0)
        {
            medianBP[..n].Fill(double.NaN);
            loBP[..n].Fill(double.NaN);
            hiBP[..n].Fill(double.NaN);
            return;
        }
        var z = new double[n];
        for (int r = 0; r < n; r++) z[r] = CompositeEvents.ToEventFree(depths[r].In(Unit));
        var med = new double[n];
        var lo = new double[n];
        var hi = new double[n];
        int[] ranks = PercentileRanks(members, [50, 2.5, 97.5]);
        int blocks = (n + RowBlock - 1) / RowBlock;
        Parallel.For(0, blocks, new ParallelOptions { CancellationToken = ct }, () => new double[RowBlock * members], (blk, loop, ages) =>
        {
            int from = blk * RowBlock, len = Math.Min(RowBlock, n - from);
            for (int i = 0; i < members; i++)
            {
                var curve = Members[i];
                int segment = -1;
                for (int r = 0; r < len; r++) ages[r * members + i] = curve.AgeAtAscending(z[from + r], ref segment, out _);
            }
            for (int r = 0; r < len; r++)
            {
                var column = ages.AsSpan(r * members, members);
                // PercentileSorted reads only the ranks selected; selection cannot order NaN, so such a column is sorted.
                if (HasNaN(column)) column.Sort();
                else Compositing.OrderStatistics.SelectRanks(column, ranks);
                med[from + r] = Statistics.PercentileSorted(column, 50);
                lo[from + r] = Statistics.PercentileSorted(column, 2.5);
                hi[from + r] = Statistics.PercentileSorted(column, 97.5);
            }
            return ages;
        }, _ => { });
        med.CopyTo(medianBP);
        lo.CopyTo(loBP);
        hi.CopyTo(hiBP);
    }

    /// <summary>The distinct ranks, ascending, that <see cref="Statistics.PercentileSorted"/> reads for these percentiles of n values.</summary>
    private static int[] PercentileRanks(int n, ReadOnlySpan<double> percents)
    {
        var ranks = new SortedSet<int>();
        foreach (double p in percents)
        {
            int k = (int)Math.Floor((n - 1) * p / 100.0);
            ranks.Add(k);
            ranks.Add(Math.Min(k + 1, n - 1));
        }
        return [.. ranks];
    }

    private static bool HasNaN(ReadOnlySpan<double> values)
    {
        foreach (double v in values) if (double.IsNaN(v)) return true;
        return false;
    }
}
