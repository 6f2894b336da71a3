using StratLink.AgeModelling;
using StratLink.ProjectIO;
using StratLink.Quantities;

namespace StratLink.Export;

/// <summary>
/// <c>ages-&lt;core&gt;.csv</c> (and <c>ages-composite.csv</c> on the composite grid): each depth with its median age
/// and 95 % range (2.5 and 97.5 percentiles of the age-model ensemble), cal BP, then its event-free depth and the
/// accumulation rate on event-free depth with its 95 % range, in depth units per year and (inverted) years per
/// depth unit. One header row, rows ascending in depth.
/// </summary>
public static class AgesCsvWriter
{
    public static string FileName(string coreId, TableFormat format = TableFormat.Csv) => $"ages-{coreId}{format.Extension()}";

    public static void Write(TextWriter writer, AgeSeries series, TableFormat format = TableFormat.Csv)
    {
        var table = new DelimitedTableWriter(writer, format);
        table.Header([$"{(series.IsComposite ? "composite_" : "")}depth_{series.Unit.Symbol()}", "age_median_bp", "age_lo_bp", "age_hi_bp", .. RateColumns(series.Unit)]);
        Rows(table, series, null);
    }

    /// <summary>Every core's ages in one table with a leading <c>core</c> column (the export command's single-table form).</summary>
    public static void WriteAll(TextWriter writer, IEnumerable<AgeSeries> series, DepthUnit unit, TableFormat format = TableFormat.Csv)
    {
        var table = new DelimitedTableWriter(writer, format);
        table.Header(["core", $"depth_{unit.Symbol()}", "age_median_bp", "age_lo_bp", "age_hi_bp", .. RateColumns(unit)]);
        foreach (var s in series) Rows(table, s, s.Id);
    }

    /// <summary>Writes <c>ages-&lt;core&gt;.csv</c> into <paramref name="directory"/> (atomically) and returns its path.</summary>
    public static string WriteFile(string directory, AgeSeries series, TableFormat format = TableFormat.Csv)
    {
        string path = Path.Combine(directory, FileName(series.Id, format));
        AtomicFile.Write(path, w => Write(w, series, format), keepBackup: false);
        return path;
    }

    private static void Rows(DelimitedTableWriter table, AgeSeries series, string? core)
    {
        var order = Enumerable.Range(0, series.Count).OrderBy(i => series.Depths[i]).ToArray();
        foreach (int i in order)
        {
            if (core is not null) table.Text(core);
            table.Number(series.Depths[i]).Number(Age(series.AgeMedianBP[i])).Number(Age(series.AgeLoBP[i])).Number(Age(series.AgeHiBP[i]));
            table.Number(series.EventFreeDepths[i]);
            table.Number(Rate(series.RateMedian[i])).Number(Rate(series.RateLo[i])).Number(Rate(series.RateHi[i]));
            // Years per unit: the inverse of the rate, so the rate's 2.5 percentile gives the time's 97.5.
            table.Number(Rate(1 / series.RateMedian[i])).Number(Rate(1 / series.RateHi[i])).Number(Rate(1 / series.RateLo[i]));
            table.EndRow();
        }
    }

    private static string[] RateColumns(DepthUnit unit)
    {
        string u = unit.Symbol();
        return [$"event_free_depth_{u}", $"rate_median_{u}_per_yr", $"rate_lo_{u}_per_yr", $"rate_hi_{u}_per_yr",
            $"time_median_yr_per_{u}", $"time_lo_yr_per_{u}", $"time_hi_yr_per_{u}"];
    }

    // Rates to 5 significant digits: enough for any rate, fewer than the Monte Carlo noise.
    private static double Rate(double value) =>
        double.IsFinite(value) && value != 0 ? Math.Round(value, Math.Clamp(4 - (int)Math.Floor(Math.Log10(Math.Abs(value))), 0, 12)) : value;

    // Ages to 0.1 yr: finer digits would only show Monte Carlo noise.
    private static double Age(double years) => Math.Round(years, 1);
}
