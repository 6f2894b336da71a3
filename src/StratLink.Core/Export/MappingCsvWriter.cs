using StratLink.AgeModelling;
using StratLink.Compositing;
using StratLink.Quantities;

namespace StratLink.Export;

/// <summary>
/// <c>mapping-&lt;core&gt;.csv</c>: every sample depth of a core with its composite depth (median
/// mapping), the 2.5/97.5 percentiles over the alignment ensemble and <c>matched</c>: 1 where the
/// sample's composite depth lies within the recovered span of at least one other core (its top to its
/// base sample through its median mapping), 0 where this core alone has record there (a part continued
/// past the reference that no other core reaches, or a top above every other core), where the
/// composite's <c>&lt;signal&gt;_n</c> is then at most 1. A core with event layers also gets its
/// event-free depth (the depth with the event layers above it cut out, on which its ages are modelled).
/// </summary>
public static class MappingCsvWriter
{
    public static string FileName(string coreId, TableFormat format = TableFormat.Csv) => $"mapping-{coreId}{format.Extension()}";

    /// <param name="site">Every core's table (this one among them), for the spans the <c>matched</c> column compares with.</param>
    public static void Write(CoreMappingTable table, IReadOnlyList<CoreMappingTable> site, TextWriter output, TableFormat format = TableFormat.Csv, EventFreeScale? events = null)
    {
        bool eventFree = events is { Count: > 0 };
        var matched = Matched(table, site);
        var w = new DelimitedTableWriter(output, format);
        w.Header(eventFree ? [.. Columns(table.Unit), $"event_free_depth_{table.Unit.Symbol()}"] : Columns(table.Unit));
        for (int i = 0; i < table.Count; i++)
        {
            w.Number(table.CoreDepths[i]).Number(table.Median[i]).Number(table.Lo[i]).Number(table.Hi[i]).Number(matched[i] ? 1 : 0);
            if (eventFree) w.Number(events!.ToEventFree(table.CoreDepths[i]));
            w.EndRow();
        }
    }

    /// <summary>Every core in one table with a leading <c>core</c> column (cores in the given order, each ascending in depth).</summary>
    public static void WriteAll(IReadOnlyList<CoreMappingTable> tables, DepthUnit unit, TextWriter output, TableFormat format = TableFormat.Csv)
    {
        var w = new DelimitedTableWriter(output, format);
        w.Header(["core", .. Columns(unit)]);
        foreach (var t in tables)
        {
            var matched = Matched(t, tables);
            for (int i = 0; i < t.Count; i++)
            {
                w.Text(t.CoreId).Number(t.CoreDepths[i]).Number(t.Median[i]).Number(t.Lo[i]).Number(t.Hi[i]).Number(matched[i] ? 1 : 0);
                w.EndRow();
            }
        }
    }

    /// <summary>Per sample of <paramref name="table"/>: whether its median composite depth lies in another core's recovered span.</summary>
    public static bool[] Matched(CoreMappingTable table, IReadOnlyList<CoreMappingTable> site)
    {
        var spans = site.Where(t => t.CoreId != table.CoreId && t.Count > 0).Select(t => (Top: t.Median[0], Base: t.Median[^1])).ToArray();
        var matched = new bool[table.Count];
        for (int i = 0; i < matched.Length; i++)
        {
            double z = table.Median[i];
            foreach (var (top, bottom) in spans)
                if (z >= top && z <= bottom) { matched[i] = true; break; }
        }
        return matched;
    }

    private static string[] Columns(DepthUnit unit)
    {
        string u = unit.Symbol();
        return [$"depth_{u}", $"composite_depth_{u}", $"composite_depth_lo_{u}", $"composite_depth_hi_{u}", "matched"];
    }
}
