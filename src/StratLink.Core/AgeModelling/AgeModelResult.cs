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
}
