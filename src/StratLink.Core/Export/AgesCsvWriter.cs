using System.Globalization;
using StratLink.AgeModelling;
using StratLink.ProjectIO;
using StratLink.Quantities;

namespace StratLink.Export;

/// <summary>
/// <c>ages-&lt;core&gt;.csv</c>: each sample's depth with its median age and 95 % range (2.5 and 97.5
/// percentiles of the age-model ensemble), cal BP. Comma-separated, invariant culture, one header row,
/// rows ascending in depth.
/// </summary>
public static class AgesCsvWriter
{
    public static string FileName(string coreId) => $"ages-{coreId}.csv";

    public static void Write(TextWriter writer, AgeSeries series)
    {
        string unit = series.Unit.Symbol();
        writer.Write($"depth_{unit},age_median_bp,age_lo_bp,age_hi_bp\n");
        var order = Enumerable.Range(0, series.Count).OrderBy(i => series.Depths[i]).ToArray();
        foreach (int i in order)
        {
            writer.Write(series.Depths[i].ToString("R", CultureInfo.InvariantCulture));
            writer.Write(',');
            writer.Write(Age(series.AgeMedianBP[i]));
            writer.Write(',');
            writer.Write(Age(series.AgeLoBP[i]));
            writer.Write(',');
            writer.Write(Age(series.AgeHiBP[i]));
            writer.Write('\n');
        }
    }

    /// <summary>Writes <c>ages-&lt;core&gt;.csv</c> into <paramref name="directory"/> (atomically) and returns its path.</summary>
    public static string WriteFile(string directory, AgeSeries series)
    {
        var sw = new StringWriter(CultureInfo.InvariantCulture);
        Write(sw, series);
        string path = Path.Combine(directory, FileName(series.Id));
        AtomicFile.WriteAllText(path, sw.ToString(), keepBackup: false);
        return path;
    }

    // Ages to 0.1 yr: finer digits would only show Monte Carlo noise.
    private static string Age(double years) => years.ToString("0.0", CultureInfo.InvariantCulture);
}
