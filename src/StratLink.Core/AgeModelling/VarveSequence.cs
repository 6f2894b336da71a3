using System.Globalization;
using StratLink.Checks;

namespace StratLink.AgeModelling;

/// <summary>
/// A counted varve sequence reduced to depth points with a signed varve count from the anchor: the top of
/// each varve and the bottom of the last, counted from the anchor depth (positive downwards, older).
/// Each point also carries the variance its count has accumulated from the anchor under the miscount model:
/// every varve is miscounted (missed or split, one year off) with its interval's miscount rate r, independently,
/// so the cumulative counting error is a random walk whose variance grows by r per varve (independent
/// per-varve errors give sigma ~ sqrt(n); Zolitschka et al. 2015, QSR 117:1-41, from memory). An optional
/// systematic relative error e adds sigma = e n on top (one factor for the whole count).
/// </summary>
public sealed class VarveSequence
{
    /// <summary>Long sequences keep at most this many points (every k-th varve top plus the ends); between kept points the curve is straight.</summary>
    public const int MaxPoints = 400;

    private VarveSequence(double[] depths, double[] counts, double[] variances, int varveCount)
    {
        Depths = depths;
        Counts = counts;
        Variances = variances;
        VarveCount = varveCount;
    }

    /// <summary>Variance (yr^2) of the random-walk counting error accumulated from the anchor to each point.</summary>
    public double[] Variances { get; }

    /// <summary>Core depths of the kept points, ascending, in the project unit.</summary>
    public double[] Depths { get; }

    /// <summary>Varves counted from the anchor to each point (negative above the anchor).</summary>
    public double[] Counts { get; }

    public int VarveCount { get; }

    /// <summary>
    /// Builds the points from varve tops and bottoms (one entry a varve, in the project unit). The anchor's
    /// own count is fractional inside a varve, the count of the next varve in a gap, and 0 above the first varve.
    /// Bad layers (bottom above top, overlaps, wrong order) give errors naming the control and the varve.
    /// </summary>
    public static VarveSequence? Build(string controlId, double[] tops, double[] bottoms, double anchorDepth, FindingList problems) =>
        Build(controlId, tops, bottoms, anchorDepth, _ => 0, problems);

    /// <param name="miscountRateAt">Miscount rate of the varve whose mid-depth is the argument.</param>
    public static VarveSequence? Build(string controlId, double[] tops, double[] bottoms, double anchorDepth, Func<double, double> miscountRateAt, FindingList problems)
    {
        if (tops.Length != bottoms.Length)
        {
            problems.Add(Finding.Error(AgeModelCodes.VarveTable, $"age control {controlId}: {tops.Length} varve tops but {bottoms.Length} bottoms") with { Item = controlId });
            return null;
        }
        if (tops.Length == 0)
        {
            problems.Add(Finding.Error(AgeModelCodes.VarveTable, $"age control {controlId}: the varve table has no varves") with { Item = controlId });
            return null;
        }
        for (int k = 0; k < tops.Length; k++)
        {
            string? why = !(bottoms[k] > tops[k]) ? "its bottom is not below its top"
                : k > 0 && tops[k] < bottoms[k - 1] ? "it starts above the bottom of the varve before (overlap or wrong order)"
                : null;
            if (why is null) continue;
            problems.Add(Finding.Error(AgeModelCodes.VarveTable, $"age control {controlId}: varve {k + 1} (depth_top {Num(tops[k])}, depth_bottom {Num(bottoms[k])}): {why}") with { Item = controlId, Depth = tops[k] });
            return null;
        }

        int n = tops.Length;
        double anchorCount;
        if (anchorDepth <= tops[0]) anchorCount = 0;
        else if (anchorDepth >= bottoms[n - 1]) anchorCount = n;
        else
        {
            int j = Array.BinarySearch(tops, anchorDepth);
            if (j < 0) j = ~j - 1;
            anchorCount = anchorDepth < bottoms[j] ? j + (anchorDepth - tops[j]) / (bottoms[j] - tops[j]) : j + 1;
        }

        // Miscount variance summed over varves 0..k-1; the anchor's share of its own varve by its fraction.
        var prefix = new double[n + 1];
        for (int k = 0; k < n; k++) prefix[k + 1] = prefix[k] + miscountRateAt(0.5 * (tops[k] + bottoms[k]));
        int whole = (int)Math.Floor(anchorCount);
        double anchorPrefix = whole >= n ? prefix[n] : prefix[whole] + (anchorCount - whole) * (prefix[whole + 1] - prefix[whole]);

        // Points: top of varve k has count k; the bottom of the last varve has count n.
        int step = Math.Max(1, (int)Math.Ceiling((n + 1) / (double)MaxPoints));
        var depths = new List<double>();
        var counts = new List<double>();
        var variances = new List<double>();
        for (int k = 0; k < n; k += step)
        {
            depths.Add(tops[k]);
            counts.Add(k - anchorCount);
            variances.Add(Math.Abs(prefix[k] - anchorPrefix));
        }
        depths.Add(bottoms[n - 1]);
        counts.Add(n - anchorCount);
        variances.Add(Math.Abs(prefix[n] - anchorPrefix));
        return new VarveSequence([.. depths], [.. counts], [.. variances], n);
    }

    private static string Num(double v) => v.ToString("0.###", CultureInfo.InvariantCulture);
}
