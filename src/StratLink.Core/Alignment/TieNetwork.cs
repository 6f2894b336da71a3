using StratLink.Checks;
using StratLink.Model;
using StratLink.Quantities;
using StratLink.Tables;

namespace StratLink.Alignment;

/// <summary>
/// Marker ties of every core to the reference. A core sharing markers with the reference is tied
/// to it directly; a core sharing none is tied through cores already tied (its marker depths in
/// the other core carried to composite depth by that core's straight-line-ties mapping), breadth
/// first, so the shortest chain wins. Ties that would fold the mapping (crossing ties) are dropped
/// with a warning.
/// </summary>
public sealed class TieNetwork
{
    private readonly Dictionary<string, IReadOnlyList<TiePoint>> _ties = new(StringComparer.Ordinal);
    private readonly Dictionary<string, DepthMapping> _lines = new(StringComparer.Ordinal);

    private TieNetwork(string reference) => Reference = reference;

    public string Reference { get; }

    /// <summary>Ties of a core, ascending in core depth; empty when it shares no marker with any tied core.</summary>
    public IReadOnlyList<TiePoint> TiesOf(string coreId) => _ties.TryGetValue(coreId, out var t) ? t : [];

    /// <summary>The straight-line-ties mapping of a core, or null when it has no ties.</summary>
    public DepthMapping? LineOf(string coreId) => _lines.GetValueOrDefault(coreId);

    public static TieNetwork Build(Project project, IReadOnlyDictionary<string, CoreTable> tables, FindingList findings)
    {
        string reference = project.ReferenceCoreId;
        var net = new TieNetwork(reference);
        var unit = project.DepthUnit;
        var (refTop, refBottom) = Extent(tables, reference, 0, 0);
        net._lines[reference] = DepthMapping.Identity(reference, unit, refTop, refBottom > refTop ? refBottom : refTop + 1);
        net._ties[reference] = [];
        var resolved = new List<string> { reference };
        var pending = project.Cores.Select(c => c.Id).Where(id => id != reference).ToList();
        while (pending.Count > 0)
        {
            var round = new List<(string Core, List<TiePoint> Ties)>();
            foreach (string core in pending)
            {
                var ties = new List<TiePoint>();
                foreach (var marker in project.Markers)
                {
                    if (marker.DepthIn(core) is not { } here) continue;
                    foreach (string via in resolved)
                    {
                        if (marker.DepthIn(via) is not { } there) continue;
                        double composite = net._lines[via].ToCompositeValue(there.In(unit));
                        ties.Add(new TiePoint(marker.Id, here.In(unit), composite, marker.Uncertainty, via));
                        break;
                    }
                }
                if (ties.Count > 0) round.Add((core, ties));
            }
            if (round.Count == 0) break;
            foreach (var (core, ties) in round)
            {
                var kept = Monotone(core, ties, findings);
                net._ties[core] = kept;
                var (top, bottom) = Extent(tables, core, kept[0].CoreDepth, kept[^1].CoreDepth);
                net._lines[core] = StraightLines(core, unit, kept, top, bottom);
                resolved.Add(core);
                pending.Remove(core);
            }
        }
        return net;
    }

    /// <summary>
    /// Piecewise linear through the ties in (core depth, composite depth); beyond the end ties it
    /// extends with the mean rate ratio of all ties (first to last), or 1 with a single tie.
    /// </summary>
    public static DepthMapping StraightLines(string coreId, DepthUnit unit, IReadOnlyList<TiePoint> ties, double top, double bottom)
    {
        var first = ties[0];
        var last = ties[^1];
        double slope = ties.Count >= 2 && last.CoreDepth > first.CoreDepth
            ? (last.CompositeDepth - first.CompositeDepth) / (last.CoreDepth - first.CoreDepth)
            : 1.0;
        var core = new List<double>();
        var comp = new List<double>();
        if (top < first.CoreDepth) { core.Add(top); comp.Add(first.CompositeDepth - slope * (first.CoreDepth - top)); }
        foreach (var t in ties) { core.Add(t.CoreDepth); comp.Add(t.CompositeDepth); }
        if (bottom > last.CoreDepth) { core.Add(bottom); comp.Add(last.CompositeDepth + slope * (bottom - last.CoreDepth)); }
        if (core.Count == 1) { core.Add(core[0] + 1); comp.Add(comp[0] + 1); }
        return new DepthMapping(coreId, unit, [.. core], [.. comp]);
    }

    private static List<TiePoint> Monotone(string core, List<TiePoint> ties, FindingList findings)
    {
        ties.Sort((a, b) => a.CoreDepth.CompareTo(b.CoreDepth));
        var kept = new List<TiePoint>();
        foreach (var t in ties)
        {
            if (kept.Count > 0 && !(t.CoreDepth > kept[^1].CoreDepth && t.CompositeDepth > kept[^1].CompositeDepth))
            {
                findings.Add(new Finding
                {
                    Severity = Severity.Warning,
                    Code = "alignment.tie-crossing",
                    Core = core,
                    Item = t.Marker,
                    Depth = t.CoreDepth,
                    Message = $"marker {t.Marker} at {t.CoreDepth:0.###} in core {core} crosses or repeats marker {kept[^1].Marker} (composite {t.CompositeDepth:0.###} after {kept[^1].CompositeDepth:0.###}); it is left out of the alignment",
                });
                continue;
            }
            kept.Add(t);
        }
        return kept;
    }

    private static (double Top, double Bottom) Extent(IReadOnlyDictionary<string, CoreTable> tables, string core, double fallbackTop, double fallbackBottom) =>
        tables.TryGetValue(core, out var t) && t.Count > 0 ? (t.Depths[0], t.Depths[^1]) : (fallbackTop, fallbackBottom);
}
