using MathNet.Numerics.Distributions;

namespace StratLink.AgeModelling;

/// <summary>
/// Accumulation-rate variability between age controls. Straight lines between controls carry no allowance for
/// the rate changing between them, so classical Monte Carlo models understate the uncertainty there (Telford et
/// al. 2004, QSR 23:1-5; Blaauw et al. 2018, QSR 188:58-66). In each iteration, every interval between
/// consecutive (drawn, ordered) controls is cut into sub-steps and the log accumulation rate takes a random walk
/// over them whose change across the whole interval has standard deviation <c>variability</c>; the sub-steps'
/// durations (the interpolated curve's, times exp of the walk) are then rescaled so the ages hit both controls
/// exactly (a bridge). Rates stay positive, so ages never decrease with depth. Beyond the end controls the rate
/// of the stretch next to the end walks on with the same variability per unit depth, so the spread grows with distance:
/// that stretch is the nearest interval, widened over further controls until it is as long as the extrapolation
/// (see <see cref="WindowEnd"/>), so an extrapolation as long as the controls' stretch is as uncertain as one interval.
/// </summary>
internal sealed class RateWalk
{
    /// <summary>Sub-steps per interval between controls (fewer when the interval spans fewer depth floors).</summary>
    public const int StepsPerInterval = 50;

    /// <summary>Cap on sub-steps beyond each end control; longer steps keep the same variance per unit depth.</summary>
    public const int MaxExtrapolationSteps = 200;

    private readonly double _variability;
    private readonly double _stepFloor;
    private readonly double _extentTop;
    private readonly double _extentBottom;

    /// <param name="variability">SD of the log-rate change across one interval between controls; positive.</param>
    /// <param name="stepFloor">Shortest sub-step (project depth unit): intervals shorter than this are not cut.</param>
    /// <param name="extentTop">Composite depth the walk must reach above the controls (the shallowest depth asked for).</param>
    /// <param name="extentBottom">Composite depth the walk must reach below the controls.</param>
    public RateWalk(double variability, double stepFloor, double extentTop, double extentBottom)
    {
        if (!(variability > 0)) throw new ArgumentOutOfRangeException(nameof(variability), "Rate variability must be positive here (0 means no walk).");
        if (!(stepFloor > 0)) throw new ArgumentOutOfRangeException(nameof(stepFloor));
        _variability = variability;
        _stepFloor = stepFloor;
        _extentTop = extentTop;
        _extentBottom = extentBottom;
    }

    /// <summary>The curve through <paramref name="controls"/>' knots with a walked rate between and beyond them.</summary>
    public AgeDepthCurve Apply(AgeDepthCurve controls, Random rng)
    {
        var z = controls.DepthSpan;
        var a = controls.AgeSpan;
        int k = z.Length;
        // The knots are counted first and written in place: a walked curve has thousands (a varve count's
        // points each make one), and growing lists for them cost more than the walk itself.
        int top = _extentTop < z[0] ? WindowEnd(z, 0, z[0] - _extentTop, +1) : 1;
        int bottom = _extentBottom > z[k - 1] ? WindowEnd(z, k - 1, _extentBottom - z[k - 1], -1) : k - 2;
        int above = _extentTop < z[0] ? ExtrapolationSteps(z[0] - _extentTop, z[top] - z[0], out _) : 0;
        int below = _extentBottom > z[k - 1] ? ExtrapolationSteps(_extentBottom - z[k - 1], z[k - 1] - z[bottom], out _) : 0;
        int count = above + 1 + below;
        for (int s = 0; s + 1 < k; s++) count += StepsFor(z[s + 1] - z[s]);
        var zs = new double[count];
        var ys = new double[count];

        // Above the top control, walked upwards from it and written from the top control's knot upwards.
        if (above > 0) Extrapolate(z[0], a[0], z[0] - _extentTop, -1, (a[top] - a[0]) / (z[top] - z[0]), z[top] - z[0], rng, zs, ys, above - 1, -1);
        int at = above;
        zs[at] = z[0];
        ys[at++] = a[0];
        for (int s = 0; s + 1 < k; s++) at = Bridge(controls, s, rng, zs, ys, at);
        if (below > 0)
            Extrapolate(z[k - 1], a[k - 1], _extentBottom - z[k - 1], +1, (a[k - 1] - a[bottom]) / (z[k - 1] - z[bottom]), z[k - 1] - z[bottom], rng, zs, ys, at, +1);
        return new AgeDepthCurve(zs, ys, z[0], z[k - 1], controls.Interpolation);
    }

    /// <summary>
    /// The knot that closes the stretch of controls next to the end knot <paramref name="end"/> (going
    /// <paramref name="direction"/>) whose rate and length calibrate the walk over <paramref name="distance"/>
    /// beyond it: the nearest interval, widened until it is as long as the distance or holds every control.
    /// With sparse controls that is the nearest interval; with a varve count's dense points it is not one
    /// varve, whose rate is that year's and whose length would scale the walk's variance to many times its
    /// own per interval over a few centimetres.
    /// </summary>
    private static int WindowEnd(ReadOnlySpan<double> z, int end, double distance, int direction)
    {
        int j = end + direction;
        while (j + direction >= 0 && j + direction < z.Length && Math.Abs(z[j] - z[end]) < distance) j += direction;
        return j;
    }

    private int StepsFor(double span) => (int)Math.Clamp(Math.Ceiling(span / _stepFloor - 1e-9), 1, StepsPerInterval);

    /// <summary>Writes the knots after control knot <paramref name="s"/> up to and including knot s + 1 from index <paramref name="at"/>; returns the next index.</summary>
    private int Bridge(AgeDepthCurve controls, int s, Random rng, double[] zs, double[] ys, int at)
    {
        var z = controls.DepthSpan;
        var a = controls.AgeSpan;
        double z0 = z[s], a0 = a[s], z1 = z[s + 1], a1 = a[s + 1];
        // Sub-steps lie in segment s: the search starts there instead of bisecting all knots at every sub-step.
        int segment = s;
        int n = StepsFor(z1 - z0);
        if (n == 1 || a1 == a0)
        {
            // One sub-step, or no time to share out: the straight line (as the interpolation gives it) is the only bridge.
            for (int j = 1; j < n; j++)
            {
                double zj = z0 + (z1 - z0) * j / n;
                zs[at] = zj;
                ys[at++] = controls.AgeAtAscending(zj, ref segment, out _);
            }
            zs[at] = z1;
            ys[at++] = a1;
            return at;
        }
        double sd = _variability / Math.Sqrt(n);
        Span<double> duration = n <= 256 ? stackalloc double[n] : new double[n];
        double w = 0, total = 0, before = a0;
        for (int j = 0; j < n; j++)
        {
            double after = j == n - 1 ? a1 : controls.AgeAtAscending(z0 + (z1 - z0) * (j + 1) / n, ref segment, out _);
            w += Normal.Sample(rng, 0, sd);
            duration[j] = Math.Max(0, after - before) * Math.Exp(w);
            total += duration[j];
            before = after;
        }
        double cumulative = 0, previous = a0;
        for (int j = 0; j < n - 1; j++)
        {
            cumulative += duration[j];
            double age = Math.Max(previous, Math.Min(a1, a0 + (a1 - a0) * cumulative / total));
            zs[at] = z0 + (z1 - z0) * (j + 1) / n;
            ys[at++] = age;
            previous = age;
        }
        zs[at] = z1;
        ys[at++] = a1;
        return at;
    }

    /// <summary>Sub-steps beyond an end control over <paramref name="distance"/>, next to an interval of <paramref name="span"/>; <paramref name="h"/> their length.</summary>
    private int ExtrapolationSteps(double distance, double span, out double h)
    {
        h = Math.Max(span / StepsFor(span), distance / MaxExtrapolationSteps);
        int steps = (int)Math.Ceiling(distance / h - 1e-9);
        h = distance / steps;
        return steps;
    }

    /// <summary>
    /// Knots from (z0, a0) outwards over <paramref name="distance"/> in direction <paramref name="sign"/> (-1 up, +1
    /// down): the stretch's mean rate times exp of a walk with its variance per unit depth.
    /// Step j goes to index <paramref name="first"/> + <paramref name="stride"/> (j - 1), so the upward walk fills its knots in depth order.
    /// </summary>
    private void Extrapolate(double z0, double a0, double distance, int sign, double yearsPerUnit, double span, Random rng,
        double[] zs, double[] ys, int first, int stride)
    {
        int steps = ExtrapolationSteps(distance, span, out double h);
        double sd = _variability * Math.Sqrt(h / span), w = 0, age = a0;
        for (int j = 1; j <= steps; j++)
        {
            w += Normal.Sample(rng, 0, sd);
            age += sign * yearsPerUnit * Math.Exp(w) * h;
            int at = first + stride * (j - 1);
            zs[at] = z0 + sign * j * h;
            ys[at] = age;
        }
    }
}
