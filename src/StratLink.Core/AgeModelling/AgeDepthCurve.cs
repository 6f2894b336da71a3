using MathNet.Numerics.Interpolation;

namespace StratLink.AgeModelling;

/// <summary>
/// One Monte Carlo member's age-depth curve on the composite depth scale: knots of strictly increasing
/// composite depth with non-decreasing ages (cal BP), interpolated linearly or by PCHIP. Above the first and
/// below the last knot it extrapolates with the rate of the nearest segment (the straight line through the
/// two end knots). A curve made by <see cref="RateWalk"/> has knots at the walk's sub-steps, also beyond the
/// controls; <see cref="TopDepth"/> and <see cref="BottomDepth"/> are always the shallowest and deepest control.
/// </summary>
public sealed class AgeDepthCurve
{
    private readonly double[] _z;
    private readonly double[] _age;
    private readonly CubicSpline? _spline;
    // Ages are held at it; the slope is left as the curve has it, so above the surface a member's rate is the one
    // it had next to it, not an infinite one, and a core's rate at its top stays readable.
    private readonly double _youngestBP = double.NegativeInfinity;

    public AgeDepthCurve(double[] compositeDepths, double[] agesBP, AgeInterpolation interpolation)
        : this(compositeDepths, agesBP, interpolation, double.NaN, double.NaN)
    {
    }

    /// <summary>Knots joined by straight lines (the walk's sub-steps) for a model whose controls span <paramref name="controlTop"/> to <paramref name="controlBottom"/>.</summary>
    internal AgeDepthCurve(double[] compositeDepths, double[] agesBP, double controlTop, double controlBottom, AgeInterpolation interpolation)
        : this(compositeDepths, agesBP, interpolation, controlTop, controlBottom)
    {
    }

    private AgeDepthCurve(double[] compositeDepths, double[] agesBP, AgeInterpolation interpolation, double controlTop, double controlBottom)
    {
        if (compositeDepths.Length != agesBP.Length) throw new ArgumentException("Knot arrays differ in length.");
        if (compositeDepths.Length < 2) throw new ArgumentException("An age-depth curve needs at least two knots at different depths.");
        for (int i = 1; i < compositeDepths.Length; i++)
        {
            if (!(compositeDepths[i] > compositeDepths[i - 1])) throw new ArgumentException($"Knot depths must increase strictly (knot {i}).");
            if (agesBP[i] < agesBP[i - 1]) throw new ArgumentException($"Ages must not decrease with depth (knot {i}).");
        }
        _z = compositeDepths;
        _age = agesBP;
        Interpolation = interpolation;
        bool walked = !double.IsNaN(controlTop);
        TopDepth = walked ? controlTop : _z[0];
        BottomDepth = walked ? controlBottom : _z[^1];
        // Two knots: PCHIP is the straight line anyway. A walked curve's sub-steps are joined by straight lines.
        if (!walked && interpolation == AgeInterpolation.MonotoneSpline && _z.Length > 2) _spline = CubicSpline.InterpolatePchipSorted(_z, _age);
    }

    private AgeDepthCurve(AgeDepthCurve curve, double youngestBP)
    {
        (_z, _age, _spline, Interpolation, TopDepth, BottomDepth) = (curve._z, curve._age, curve._spline, curve.Interpolation, curve.TopDepth, curve.BottomDepth);
        _youngestBP = Math.Max(curve._youngestBP, youngestBP);
    }

    /// <summary>
    /// The same curve with no age younger than <paramref name="youngestBP"/> (the coring year): above the depth
    /// where it reaches that age, where the member has no sediment, it stays at it instead of extrapolating
    /// into the future. The knots are unchanged.
    /// </summary>
    internal AgeDepthCurve NoYoungerThan(double youngestBP) => new(this, youngestBP);

    public AgeInterpolation Interpolation { get; }
    public IReadOnlyList<double> CompositeDepths => _z;
    public IReadOnlyList<double> AgesBP => _age;

    /// <summary>The knots' depths and ages without the interface calls of <see cref="CompositeDepths"/> (hot loops).</summary>
    internal ReadOnlySpan<double> DepthSpan => _z;

    internal ReadOnlySpan<double> AgeSpan => _age;

    /// <summary>Composite depth of the shallowest control.</summary>
    public double TopDepth { get; }

    /// <summary>Composite depth of the deepest control.</summary>
    public double BottomDepth { get; }

    /// <summary>True when <paramref name="compositeDepth"/> lies above the shallowest or below the deepest control.</summary>
    public bool IsExtrapolated(double compositeDepth) => compositeDepth < TopDepth || compositeDepth > BottomDepth;

    public double AgeAt(double compositeDepth) => AgeAt(compositeDepth, out _);

    /// <summary>Age (cal BP) at a composite depth and the slope d(age)/d(depth) there, years per depth unit.</summary>
    public double AgeAt(double compositeDepth, out double yearsPerUnit)
    {
        int n = _z.Length;
        if (compositeDepth <= _z[0] || compositeDepth >= _z[n - 1] || _spline is null)
        {
            int i = Segment(compositeDepth);
            yearsPerUnit = (_age[i + 1] - _age[i]) / (_z[i + 1] - _z[i]);
            return Math.Max(_age[i] + yearsPerUnit * (compositeDepth - _z[i]), _youngestBP);
        }
        yearsPerUnit = _spline.Differentiate(compositeDepth);
        return Math.Max(_spline.Interpolate(compositeDepth), _youngestBP);
    }

    /// <summary>
    /// <see cref="AgeAt(double, out double)"/> for depths mostly visited in ascending order: <paramref name="segment"/>
    /// (start at -1) carries the search on from the previous depth, so a walked curve's many knots cost little.
    /// </summary>
    internal double AgeAtAscending(double compositeDepth, ref int segment, out double yearsPerUnit)
    {
        if (_spline is not null) return AgeAt(compositeDepth, out yearsPerUnit);
        double age = UnboundedAgeAtAscending(compositeDepth, ref segment);
        yearsPerUnit = (_age[segment + 1] - _age[segment]) / (_z[segment + 1] - _z[segment]);
        return Math.Max(age, _youngestBP);
    }

    /// <summary>An age read by <see cref="UnboundedAgeAtAscending"/> held at the coring-year floor, as every other read is.</summary>
    internal double Floored(double ageBP) => Math.Max(ageBP, _youngestBP);

    /// <summary>
    /// The age <see cref="AgeAtAscending"/> reads before the coring-year floor, so a rate read across the sediment
    /// surface keeps the slope the member has next to it.
    /// </summary>
    internal double UnboundedAgeAtAscending(double compositeDepth, ref int segment)
    {
        if (_spline is not null && compositeDepth > _z[0] && compositeDepth < _z[^1]) return _spline.Interpolate(compositeDepth);
        int i = segment;
        if (i < 0 || compositeDepth < _z[i]) i = Segment(compositeDepth);
        else while (i < _z.Length - 2 && _z[i + 1] <= compositeDepth) i++;
        segment = i;
        double yearsPerUnit = (_age[i + 1] - _age[i]) / (_z[i + 1] - _z[i]);
        return _age[i] + yearsPerUnit * (compositeDepth - _z[i]);
    }

    private int Segment(double z)
    {
        int n = _z.Length;
        if (z <= _z[0]) return 0;
        if (z >= _z[n - 1]) return n - 2;
        int lo = 0, hi = n - 1;
        while (hi - lo > 1)
        {
            int mid = (lo + hi) >>> 1;
            if (_z[mid] <= z) lo = mid; else hi = mid;
        }
        return lo;
    }
}
