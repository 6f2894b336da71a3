using System.Globalization;
using StratLink.Checks;
using StratLink.ProjectIO;

namespace StratLink.AgeModelling.Calibration;

/// <summary>
/// A radiocarbon calibration curve in the community's plain-text form: <c>#</c> header lines, then rows
/// of calendar age (cal BP), 14C age, its 1 sigma and optionally Delta14C and its 1 sigma, comma-separated
/// (IntCal20, Marine20, SHCal20 files; Reimer et al. 2020). Rows may run either way in time and the step
/// need not be constant; they are kept ascending in calendar age.
/// </summary>
public sealed class CalibrationCurve
{
    public const string CodeFormat = "curve.format";

    private readonly Lazy<(int Start, double[] Mu, double[] Sigma)> _yearGrid;

    private CalibrationCurve(string name, double[] calBP, double[] c14, double[] sigma, double[]? delta14C)
    {
        Name = name;
        CalBP = calBP;
        C14Age = c14;
        C14Sigma = sigma;
        Delta14C = delta14C;
        _yearGrid = new Lazy<(int, double[], double[])>(BuildYearGrid);
    }

    /// <summary>File name or label, for messages.</summary>
    public string Name { get; }

    /// <summary>Calendar ages of the rows, cal BP, strictly ascending.</summary>
    public IReadOnlyList<double> CalBP { get; }

    /// <summary>14C age of each row, 14C yr BP.</summary>
    public IReadOnlyList<double> C14Age { get; }

    /// <summary>1 sigma of each row's 14C age.</summary>
    public IReadOnlyList<double> C14Sigma { get; }

    /// <summary>The file's Delta14C column (permil), or null when the file has only three columns.</summary>
    public IReadOnlyList<double>? Delta14C { get; }

    public int Count => CalBP.Count;

    /// <summary>First whole calendar year of the 1-yr grid (the youngest end, rounded inwards).</summary>
    public int GridStartBP => _yearGrid.Value.Start;

    /// <summary>14C age interpolated linearly onto whole calendar years from <see cref="GridStartBP"/> (computed once per curve).</summary>
    public IReadOnlyList<double> GridMu => _yearGrid.Value.Mu;

    /// <summary>1 sigma interpolated linearly onto the same whole years.</summary>
    public IReadOnlyList<double> GridSigma => _yearGrid.Value.Sigma;

    internal double[] GridMuArray => _yearGrid.Value.Mu;
    internal double[] GridSigmaArray => _yearGrid.Value.Sigma;

    /// <summary>Reads a curve file; problems (missing file, bad row) go to <paramref name="problems"/> with file, line and column, and null is returned.</summary>
    public static CalibrationCurve? Load(string path, FindingList problems)
    {
        string text;
        try
        {
            text = TextDecoding.Decode(File.ReadAllBytes(path));
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            problems.AddError(CodeFormat, $"cannot read the calibration curve: {e.Message}", path);
            return null;
        }
        return Parse(text, path, problems);
    }

    /// <summary>Parses curve text; <paramref name="fileName"/> names the source in messages.</summary>
    public static CalibrationCurve? Parse(string text, string fileName, FindingList problems)
    {
        var cal = new List<double>();
        var c14 = new List<double>();
        var sig = new List<double>();
        var d14 = new List<double>();
        var lines = new List<int>();
        bool hasDelta = true, ok = true;
        string[] fields = ["CAL BP", "14C age", "Sigma", "Delta 14C", "Sigma"];
        int lineNo = 0;
        foreach (string raw in text.Split(["\r\n", "\r", "\n"], StringSplitOptions.None))
        {
            lineNo++;
            string line = raw.Trim();
            if (line.Length == 0 || line[0] == '#') continue;
            string[] parts = line.Contains(',')
                ? line.Split(',', StringSplitOptions.TrimEntries)
                : line.Split([' ', '\t'], StringSplitOptions.RemoveEmptyEntries);
            if (parts.Length < 3)
            {
                problems.AddError(CodeFormat, $"a curve row needs at least 3 columns (cal BP, 14C age, sigma), found {parts.Length}", fileName, lineNo);
                ok = false;
                continue;
            }
            var values = new double[Math.Min(parts.Length, 5)];
            bool rowOk = true;
            for (int k = 0; k < values.Length; k++)
            {
                if (!double.TryParse(parts[k], NumberStyles.Float, CultureInfo.InvariantCulture, out values[k]) || !double.IsFinite(values[k]))
                {
                    problems.AddError(CodeFormat, $"'{parts[k]}' is not a number", fileName, lineNo, fields[k]);
                    rowOk = false;
                }
            }
            if (rowOk && values[2] < 0)
            {
                problems.AddError(CodeFormat, "a sigma cannot be negative", fileName, lineNo, fields[2]);
                rowOk = false;
            }
            if (!rowOk) { ok = false; continue; }
            cal.Add(values[0]);
            c14.Add(values[1]);
            sig.Add(values[2]);
            if (values.Length >= 4) d14.Add(values[3]); else hasDelta = false;
            lines.Add(lineNo);
        }
        if (!ok) return null;
        if (cal.Count < 2)
        {
            problems.AddError(CodeFormat, $"a calibration curve needs at least 2 rows, found {cal.Count}", fileName);
            return null;
        }
        bool descending = cal[1] < cal[0];
        for (int i = 1; i < cal.Count; i++)
        {
            if (descending ? cal[i] < cal[i - 1] : cal[i] > cal[i - 1]) continue;
            problems.AddError(CodeFormat, $"calendar ages must run one way without repeats ({cal[i - 1].ToString(CultureInfo.InvariantCulture)} then {cal[i].ToString(CultureInfo.InvariantCulture)})", fileName, lines[i], fields[0]);
            return null;
        }
        if (descending)
        {
            cal.Reverse();
            c14.Reverse();
            sig.Reverse();
            d14.Reverse();
        }
        return new CalibrationCurve(fileName, [.. cal], [.. c14], [.. sig], hasDelta ? [.. d14] : null);
    }

    /// <summary>Builds a curve from arrays ascending in calendar age (synthetic curves, tests).</summary>
    public static CalibrationCurve FromArrays(string name, double[] calBP, double[] c14Age, double[] sigma)
    {
        if (calBP.Length != c14Age.Length || calBP.Length != sigma.Length) throw new ArgumentException("Curve arrays differ in length.");
        if (calBP.Length < 2) throw new ArgumentException("A calibration curve needs at least 2 rows.");
        for (int i = 1; i < calBP.Length; i++)
            if (!(calBP[i] > calBP[i - 1])) throw new ArgumentException($"Calendar ages must be strictly ascending (row {i}).");
        return new CalibrationCurve(name, calBP, c14Age, sigma, null);
    }

    private (int, double[], double[]) BuildYearGrid()
    {
        var x = (double[])CalBP;
        var mu = (double[])C14Age;
        var s = (double[])C14Sigma;
        int start = (int)Math.Ceiling(x[0]);
        int end = (int)Math.Floor(x[^1]);
        int n = Math.Max(0, end - start + 1);
        var gm = new double[n];
        var gs = new double[n];
        int seg = 0;
        for (int k = 0; k < n; k++)
        {
            double t = start + k;
            while (seg < x.Length - 2 && x[seg + 1] < t) seg++;
            double w = (t - x[seg]) / (x[seg + 1] - x[seg]);
            gm[k] = mu[seg] + w * (mu[seg + 1] - mu[seg]);
            gs[k] = s[seg] + w * (s[seg + 1] - s[seg]);
        }
        return (start, gm, gs);
    }
}
