using StratLink.AgeModelling;
using StratLink.Compositing;
using StratLink.Quantities;

namespace StratLink.Export;

/// <summary>
/// <c>mapping-&lt;core&gt;.csv</c>: every sample depth of a core with its composite depth (median
/// mapping) and the 2.5/97.5 percentiles over the alignment ensemble; a core with event layers also gets its
/// event-free depth (the depth with the event layers above it cut out, on which its ages are modelled).
/// </summary>
public static class MappingCsvWriter
{
    public static string FileName(string coreId, TableFormat format = TableFormat.Csv) => $"mapping-{coreId}{format.Extension()}";

    public static void Write(CoreMappingTable table, TextWriter output, TableFormat format = TableFormat.Csv, EventFreeScale? events = null)
    {
        bool eventFree = events is { Count: > 0 };
        var w = new DelimitedTableWriter(output, format);
        w.Header(eventFree ? [.. Columns(table.Unit), $"event_free_depth_{table.Unit.Symbol()}"] : Columns(table.Unit));
        for (int i = 0; i < table.Count; i++)
        {
            w.Number(table.CoreDepths[i]).Number(table.Median[i]).Number(table.Lo[i]).Number(table.Hi[i]);
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
            for (int i = 0; i < t.Count; i++)
            {
                w.Text(t.CoreId).Number(t.CoreDepths[i]).Number(t.Median[i]).Number(t.Lo[i]).Number(t.Hi[i]);
                w.EndRow();
            }
    }

    private static string[] Columns(DepthUnit unit)
    {
        string u = unit.Symbol();
        return [$"depth_{u}", $"composite_depth_{u}", $"composite_depth_lo_{u}", $"composite_depth_hi_{u}"];
    }
}
