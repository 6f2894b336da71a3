using StratLink.Compositing;
using StratLink.Quantities;

namespace StratLink.Export;

/// <summary><c>splice.csv</c>: the splice intervals, ascending, in composite depth and in the depths of their cores.</summary>
public static class SpliceCsvWriter
{
    public static void Write(Splice splice, DepthUnit unit, TextWriter output, TableFormat format = TableFormat.Csv)
    {
        string u = unit.Symbol();
        var w = new DelimitedTableWriter(output, format);
        w.Header([$"composite_depth_from_{u}", $"composite_depth_to_{u}", "core", $"core_depth_from_{u}", $"core_depth_to_{u}"]);
        foreach (var p in splice.Pieces)
        {
            w.Number(p.From.In(unit)).Number(p.To.In(unit)).Text(p.Core).Number(p.CoreFrom.In(unit)).Number(p.CoreTo.In(unit));
            w.EndRow();
        }
    }
}
