using StratLink.Quantities;

namespace StratLink.Alignment;

/// <summary>
/// A monotone piecewise-linear map between one core's depth scale and the composite depth scale,
/// given by knots (core depth, composite depth), both non-decreasing. Beyond the knots it extends
/// with the slope of the end segment (the local rate ratio).
/// </summary>
public sealed class DepthMapping
{
    private readonly double[] _core;
    private readonly double[] _composite;

    public DepthMapping(string coreId, DepthUnit unit, double[] coreDepths, double[] compositeDepths)
    {
        if (coreDepths.Length != compositeDepths.Length) throw new ArgumentException("Knot arrays differ in length.");
        if (coreDepths.Length < 1) throw new ArgumentException("A mapping needs at least one knot.");
        for (int i = 1; i < coreDepths.Length; i++)
        {
            if (coreDepths[i] < coreDepths[i - 1] || compositeDepths[i] < compositeDepths[i - 1])
                throw new ArgumentException($"Mapping of core {coreId} is not monotone at knot {i}.");
        }
        CoreId = coreId;
        Unit = unit;
        _core = coreDepths;
        _composite = compositeDepths;
    }

    /// <summary>The identity: the reference core's own mapping.</summary>
    public static DepthMapping Identity(string coreId, DepthUnit unit, double top, double bottom) =>
        new(coreId, unit, [top, bottom], [top, bottom]);

    public string CoreId { get; }
    public DepthUnit Unit { get; }
    public IReadOnlyList<double> CoreKnots => _core;
    public IReadOnlyList<double> CompositeKnots => _composite;

    public CompositeDepth ToComposite(CoreDepth depth) => CompositeDepth.From(ToCompositeValue(depth.In(Unit)), Unit);

    public CoreDepth ToCore(CompositeDepth depth) => CoreDepth.From(ToCoreValue(depth.In(Unit)), Unit);

    /// <summary>Raw form of <see cref="ToComposite"/> for values already in <see cref="Unit"/> (hot loops).</summary>
    public double ToCompositeValue(double coreDepth) => Interpolate(_core, _composite, coreDepth);

    /// <summary>Raw form of <see cref="ToCore"/> for values already in <see cref="Unit"/>.</summary>
    public double ToCoreValue(double compositeDepth) => Interpolate(_composite, _core, compositeDepth);

    /// <summary>d(composite)/d(core) at a core depth: the accumulation-rate ratio reference/core.</summary>
    public double RateRatioAt(double coreDepth)
    {
        if (_core.Length < 2) return 1;
        int i = Segment(_core, coreDepth);
        double dx = _core[i + 1] - _core[i];
        return dx > 0 ? (_composite[i + 1] - _composite[i]) / dx : 1;
    }

    private static double Interpolate(double[] xs, double[] ys, double x)
    {
        if (xs.Length == 1) return ys[0] + (x - xs[0]);
        int i = Segment(xs, x);
        double dx = xs[i + 1] - xs[i];
        if (dx <= 0) return ys[i];
        return ys[i] + (ys[i + 1] - ys[i]) * (x - xs[i]) / dx;
    }

    /// <summary>Index i of the segment [xs[i], xs[i+1]] used for x (end segments extend outwards).</summary>
    private static int Segment(double[] xs, double x)
    {
        int n = xs.Length;
        if (x <= xs[0]) return FirstProper(xs);
        if (x >= xs[n - 1]) return LastProper(xs);
        int lo = 0, hi = n - 1;
        while (hi - lo > 1)
        {
            int mid = (lo + hi) >>> 1;
            if (xs[mid] <= x) lo = mid; else hi = mid;
        }
        return lo;
    }

    // End segments of zero length would give no slope; use the nearest one that has length.
    private static int FirstProper(double[] xs)
    {
        for (int i = 0; i < xs.Length - 1; i++) if (xs[i + 1] > xs[i]) return i;
        return 0;
    }

    private static int LastProper(double[] xs)
    {
        for (int i = xs.Length - 2; i >= 0; i--) if (xs[i + 1] > xs[i]) return i;
        return Math.Max(0, xs.Length - 2);
    }
}
