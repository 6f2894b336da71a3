using StratLink.Alignment;
using StratLink.Model;
using StratLink.Quantities;
using StratLink.Tables;

namespace StratLink.Compositing;

/// <summary>
/// One core prepared for compositing: its table, mappings, unusable intervals and usable samples per signal. The
/// samples leave out the core's event layers unless <c>keepEvents</c>: an event bed is not the background signal the
/// stacks, the splice's values and the analyses describe.
/// </summary>
internal sealed class CompositeCore
{
    /// <summary>
    /// Missing samples are interpolated across only while the two usable neighbours are at most this
    /// many median sample spacings apart (one or two missing values); wider holes stay empty. Our choice.
    /// </summary>
    public const double BridgeSpacings = 2.5;

    public CompositeCore(int index, CoreSpec spec, CoreTable table, MappingEnsemble ensemble, IEnumerable<string> signals, bool standardise, DepthUnit unit,
        bool keepEvents = false)
    {
        _events = keepEvents ? AgeModelling.EventFreeScale.None : AgeModelling.EventFreeScale.Of(spec, unit);
        Index = index;
        Spec = spec;
        Table = table;
        Ensemble = ensemble;
        Unusable = new UnusableIntervals(spec, unit);
        Mappings = ensemble.Members.Count > 0 ? ensemble.Members : [ensemble.Median];
        double bridge = BridgeSpacings * MedianSpacing(table.Depths);
        var samples = new Dictionary<string, SignalSamples>(StringComparer.Ordinal);
        foreach (string s in signals)
            if (table.Signals.TryGetValue(s, out var values)) samples[s] = Usable(s, table.Depths, values, bridge, standardise);
        Samples = samples;
    }

    private readonly AgeModelling.EventFreeScale _events;

    public int Index { get; }
    public string Id => Spec.Id;
    public CoreSpec Spec { get; }
    public CoreTable Table { get; }
    public MappingEnsemble Ensemble { get; }
    public UnusableIntervals Unusable { get; }

    /// <summary>The ensemble members, or the median alone when the alignment gave no members.</summary>
    public IReadOnlyList<DepthMapping> Mappings { get; }

    /// <summary>Signal name to its usable samples (only the signals this core has).</summary>
    public IReadOnlyDictionary<string, SignalSamples> Samples { get; }

    public double RecoveredTop => Table.Depths[0];
    public double RecoveredBottom => Table.Depths[^1];

    private SignalSamples Usable(string name, double[] depths, double[] values, double bridge, bool standardise)
    {
        var d = new List<double>(depths.Length);
        var v = new List<double>(depths.Length);
        var cursor = Unusable.Start();
        for (int i = 0; i < depths.Length; i++)
        {
            // The cursor must see every depth in order, so test it before the NaN check.
            bool unusable = cursor.IsUnusable(depths[i]);
            if (unusable || double.IsNaN(values[i]) || _events.Covers(depths[i])) continue;
            d.Add(depths[i]);
            v.Add(values[i]);
        }
        double centre = 0, scale = 1;
        if (standardise)
        {
            // z-score over the core's usable samples with the sample standard deviation (n - 1), common practice.
            centre = v.Count > 0 ? v.Average() : double.NaN;
            double ss = 0;
            foreach (double x in v) ss += (x - centre) * (x - centre);
            scale = v.Count > 1 ? Math.Sqrt(ss / (v.Count - 1)) : double.NaN;
            // A constant or single-valued signal has no z-score: it then contributes nothing.
            if (!(scale > 0)) return new SignalSamples(name, [], [], bridge, centre, scale);
            for (int i = 0; i < v.Count; i++) v[i] = (v[i] - centre) / scale;
        }
        return new SignalSamples(name, [.. d], [.. v], bridge, centre, scale);
    }

    private static double MedianSpacing(double[] depths)
    {
        if (depths.Length < 2) return 0;
        var steps = new double[depths.Length - 1];
        for (int i = 0; i < steps.Length; i++) steps[i] = depths[i + 1] - depths[i];
        Array.Sort(steps);
        return Statistics.PercentileSorted(steps, 50);
    }
}
