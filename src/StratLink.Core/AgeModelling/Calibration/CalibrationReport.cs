using System.Globalization;
using System.Text;
using System.Text.Json;
using StratLink.Quantities;

namespace StratLink.AgeModelling.Calibration;

/// <summary>
/// What a single calibration says, in three forms: lines of text with a density plot for a terminal,
/// JSON for scripts, and the density as CSV (age_bp, probability). Numbers are in the invariant culture.
/// </summary>
public sealed class CalibrationReport
{
    /// <summary>The HPD levels reported (1 and 2 sigma of a normal distribution) and their usual labels.</summary>
    public static readonly IReadOnlyList<(double Level, string Label)> Levels =
        [(CalibratedDensity.OneSigmaLevel, "68.3"), (CalibratedDensity.TwoSigmaLevel, "95.4")];

    public CalibrationReport(RadiocarbonAge c14Age, double c14Error, double deltaR, double deltaRError, CalibrationResult result)
    {
        C14Age = c14Age;
        C14Error = c14Error;
        DeltaR = deltaR;
        DeltaRError = deltaRError;
        Result = result;
    }

    public RadiocarbonAge C14Age { get; }
    public double C14Error { get; }
    public double DeltaR { get; }
    public double DeltaRError { get; }
    public CalibrationResult Result { get; }

    /// <summary>Ranges in the text report are rounded outward to this many years (JSON keeps whole years).</summary>
    public const int TextRoundingYears = 5;

    /// <summary>The report for a terminal: inputs, median, HPD ranges (rounded outward) with probabilities, then a density plot <paramref name="plotWidth"/> columns wide.</summary>
    public IReadOnlyList<string> ToLines(int plotWidth = 64, int plotHeight = 6)
    {
        var lines = new List<string>
        {
            $"Radiocarbon age   {F0(C14Age.Years)} +- {F0(C14Error)} 14C yr BP",
            $"Curve             {Result.CurveName}",
        };
        if (DeltaR != 0 || DeltaRError != 0)
        {
            lines.Add($"Reservoir offset  Delta-R {F0(DeltaR)} +- {F0(DeltaRError)} 14C yr");
            lines.Add($"Calibrated as     {F0(Result.EffectiveC14Age)} +- {F0(Result.EffectiveC14Error)} 14C yr BP");
        }
        if (Result.Message is not null) lines.Add((Result.IsUsable ? "Warning: " : "No calendar age: ") + Result.Message);
        if (!Result.IsUsable) return lines;

        var d = Result.Density;
        lines.Add($"Median            {F0(d.Median)} cal BP");
        foreach (var (level, levelLabel) in Levels)
        {
            var ranges = d.HpdRoundedOutward(level, TextRoundingYears);
            string label = $"{levelLabel} % range";
            for (int i = 0; i < ranges.Length; i++)
                lines.Add($"{(i == 0 ? label : ""),-18}{ranges[i].YoungBP,6} to {ranges[i].OldBP,6} cal BP  ({Pct(ranges[i].Probability),5} %)");
        }
        lines.Add($"(ranges: highest posterior density, rounded outward to {TextRoundingYears} yr)");
        lines.Add("");
        lines.AddRange(Plot(d, plotWidth, plotHeight));
        return lines;
    }

    /// <summary>Median and HPD ranges as one JSON object (snake_case keys).</summary>
    public string ToJson()
    {
        using var stream = new MemoryStream();
        using (var w = new Utf8JsonWriter(stream, new JsonWriterOptions { Indented = true }))
        {
            w.WriteStartObject();
            w.WriteNumber("c14_age", C14Age.Years);
            w.WriteNumber("c14_error", C14Error);
            w.WriteNumber("delta_r", DeltaR);
            w.WriteNumber("delta_r_error", DeltaRError);
            w.WriteString("curve", Result.CurveName);
            w.WriteString("status", Result.Status.ToString().ToLowerInvariant());
            if (Result.Message is null) w.WriteNull("message"); else w.WriteString("message", Result.Message);
            if (Result.IsUsable)
            {
                var d = Result.Density;
                w.WriteNumber("median_bp", Math.Round(d.Median, 1));
                w.WriteStartArray("hpd");
                foreach (var (level, _) in Levels)
                {
                    w.WriteStartObject();
                    w.WriteNumber("level", level);
                    w.WriteStartArray("ranges");
                    foreach (var r in d.Hpd(level))
                    {
                        w.WriteStartObject();
                        w.WriteNumber("young_bp", r.YoungBP);
                        w.WriteNumber("old_bp", r.OldBP);
                        w.WriteNumber("probability", Math.Round(r.Probability, 4));
                        w.WriteEndObject();
                    }
                    w.WriteEndArray();
                    w.WriteEndObject();
                }
                w.WriteEndArray();
            }
            w.WriteEndObject();
        }
        return Encoding.UTF8.GetString(stream.ToArray());
    }

    /// <summary>Writes the density: header <c>age_bp,probability</c>, one row per calendar year, ascending; probabilities sum to 1.</summary>
    public static void WriteDensityCsv(TextWriter writer, CalibratedDensity density)
    {
        writer.Write("age_bp,probability\n");
        for (int k = 0; k < density.Count; k++)
        {
            writer.Write((density.StartBP + k).ToString(CultureInfo.InvariantCulture));
            writer.Write(',');
            writer.Write(density.Probabilities[k].ToString("R", CultureInfo.InvariantCulture));
            writer.Write('\n');
        }
    }

    /// <summary>Bars of the density over its central 99.9 %, an axis marking the 95.4 % ranges (=) and the median (|), and the end ages.</summary>
    public static IReadOnlyList<string> Plot(CalibratedDensity d, int width, int height)
    {
        int from = (int)Math.Floor(d.InverseCdf(0.0005)), to = (int)Math.Ceiling(d.InverseCdf(0.9995));
        int pad = Math.Max(2, (to - from) / 10);
        from -= pad;
        to += pad;
        width = Math.Max(10, width);
        var bins = TextBars.SumIntoBins(d.Probabilities, from - d.StartBP, to - d.StartBP, width);
        var lines = new List<string>(TextBars.Render(bins, height));
        var axis = new char[width];
        Array.Fill(axis, '-');
        double yearsPerColumn = (double)(to - from + 1) / width;
        foreach (var r in d.Hpd(CalibratedDensity.TwoSigmaLevel))
            for (int c = Column(r.YoungBP); c <= Column(r.OldBP); c++) axis[c] = '=';
        axis[Column((int)Math.Round(d.Median))] = '|';
        lines.Add(new string(axis));
        string left = $"{from} cal BP", right = $"{to} cal BP";
        lines.Add(left + new string(' ', Math.Max(1, width - left.Length - right.Length)) + right);
        return lines;

        int Column(int year) => Math.Clamp((int)((year - from) / yearsPerColumn), 0, width - 1);
    }

    private static string F0(double v) => v.ToString("0", CultureInfo.InvariantCulture);
    private static string Pct(double p) => (100 * p).ToString("0.0", CultureInfo.InvariantCulture);
}
