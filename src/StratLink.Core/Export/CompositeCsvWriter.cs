using StratLink.Compositing;
using StratLink.Quantities;

namespace StratLink.Export;

/// <summary>
/// <c>composite.csv</c>: one row per composite grid row with its age (empty cells without an age
/// model), the splice's core, and per signal the stacked mean, 2.5/97.5 band, number of cores and the
/// spliced value. Whether the signals are in their own units or z-scores is
/// <see cref="CompositeResult.ScaleNote"/>, recorded in the run metadata.
/// </summary>
public static class CompositeCsvWriter
{
    public static IReadOnlyList<string> Columns(CompositeResult result)
    {
        var cols = new List<string> { $"composite_depth_{result.Grid.Unit.Symbol()}", "age_median_bp", "age_lo_bp", "age_hi_bp", "source_core" };
        foreach (var r in result.Records)
            cols.AddRange([$"{r.Signal}_mean", $"{r.Signal}_lo", $"{r.Signal}_hi", $"{r.Signal}_n", $"{r.Signal}_splice"]);
        return cols;
    }

    public static void Write(CompositeResult result, TextWriter output, TableFormat format = TableFormat.Csv)
    {
        var w = new DelimitedTableWriter(output, format);
        w.Header(Columns(result));
        var grid = result.Grid;
        var ages = result.Ages;
        for (int row = 0; row < grid.Count; row++)
        {
            w.Number(grid.ValueAt(row));
            w.Number(ages?.MedianBP[row] ?? double.NaN).Number(ages?.LoBP[row] ?? double.NaN).Number(ages?.HiBP[row] ?? double.NaN);
            w.Text(result.Splice.SourceByRow[row]);
            foreach (var r in result.Records)
                w.Number(r.Mean[row]).Number(r.Lo[row]).Number(r.Hi[row]).Number(r.N[row]).Number(r.Spliced[row]);
            w.EndRow();
        }
    }
}
