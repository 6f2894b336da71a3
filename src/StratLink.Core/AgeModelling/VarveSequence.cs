using System.Globalization;
using StratLink.Checks;

namespace StratLink.AgeModelling;

/// <summary>
/// A counted varve sequence reduced to depth points with a signed varve count from the anchor: the top of
/// each varve and the bottom of the last, counted from the anchor depth (positive downwards, older).
/// The age at a point is anchor age + count x (1 + e z) in each iteration, z ~ N(0, 1) once for the whole
/// sequence: the counting error is treated as systematic, sigma = e n, growing with the number of varves
/// counted (methods: varve counting errors, "systematic relative error e gives sigma = e n"; Zolitschka et
/// al. 2015, QSR 117:1-41). This is the conservative choice: independent per-varve errors would give sigma
/// ~ sqrt(n), which is smaller for long sequences.
/// </summary>
public sealed class VarveSequence
{
    /// <summary>Long sequences keep at most this many points (every k-th varve top plus the ends); between kept points the curve is straight.</summary>
    public const int MaxPoints = 400;

    private VarveSequence(double[] depths, double[] counts, int varveCount)
    {
        Depths = depths;
        Counts = counts;
        VarveCount = varveCount;
    }

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
    public static VarveSequence? Build(string controlId, double[] tops, double[] bottoms, double anchorDepth, FindingList problems)
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

        // Points: top of varve k has count k; the bottom of the last varve has count n.
        int step = Math.Max(1, (int)Math.Ceiling((n + 1) / (double)MaxPoints));
        var depths = new List<double>();
        var counts = new List<double>();
        for (int k = 0; k < n; k += step)
        {
            depths.Add(tops[k]);
            counts.Add(k - anchorCount);
        }
        depths.Add(bottoms[n - 1]);
        counts.Add(n - anchorCount);
        return new VarveSequence([.. depths], [.. counts], n);
    }

    private static string Num(double v) => v.ToString("0.###", CultureInfo.InvariantCulture);
}
