using System.Globalization;

namespace StratLink.Checks;

/// <summary>
/// Reads only the 14C span of a calibration curve file in the usual distributed form: comma-separated
/// rows of calendar age, 14C age, sigma, ... with '#' comment lines (IntCal20 and Marine20 files, Reimer
/// et al. 2020; Heaton et al. 2020).
/// </summary>
public static class CurveRangeReader
{
    /// <summary>The youngest and oldest 14C age of the curve, or null when the file is unreadable or has no rows.</summary>
    public static RadiocarbonRange? Read(string path)
    {
        try
        {
            double lo = double.PositiveInfinity, hi = double.NegativeInfinity;
            foreach (string raw in File.ReadLines(path))
            {
                string line = raw.Trim();
                if (line.Length == 0 || line[0] == '#') continue;
                string[] cells = line.Split([',', '\t', ' '], StringSplitOptions.RemoveEmptyEntries);
                if (cells.Length < 2 || !double.TryParse(cells[1], NumberStyles.Float, CultureInfo.InvariantCulture, out double c14)
                    || !double.IsFinite(c14)) continue;
                lo = Math.Min(lo, c14);
                hi = Math.Max(hi, c14);
            }
            return lo <= hi ? new RadiocarbonRange(lo, hi) : null;
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            return null;
        }
    }
}
