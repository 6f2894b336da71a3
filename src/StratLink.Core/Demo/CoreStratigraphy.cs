namespace StratLink.Demo;

/// <summary>
/// One core's true depth-age relation: depth is the integral of its accumulation rate over age plus the
/// thickness of every event layer deposited since. Stored as a piecewise-linear list of nodes in the
/// complete column (depth below the sediment surface at coring); an event layer is a segment of
/// constant age. Core depth = column depth minus the lost top.
/// </summary>
internal sealed class CoreStratigraphy
{
    private readonly double[] _depth;
    private readonly double[] _age;
    private readonly int[] _segmentEvent;

    private CoreStratigraphy(double[] depth, double[] age, int[] segmentEvent, double lostTop)
    {
        _depth = depth;
        _age = age;
        _segmentEvent = segmentEvent;
        LostTop = lostTop;
    }

    /// <summary>Column depth of core depth 0 (sediment missing above the core top).</summary>
    public double LostTop { get; }

    /// <param name="agesBP">Annual age grid, ascending.</param>
    /// <param name="rate">Accumulation rate at each grid age (depth unit per year).</param>
    /// <param name="events">Event ages and their thickness in this core (0 = absent), ascending in age, none on a grid age.</param>
    public static CoreStratigraphy Build(double[] agesBP, double[] rate, IReadOnlyList<(double AgeBP, double Thickness)> events, double lostTop)
    {
        var depth = new List<double>(agesBP.Length + 2 * events.Count);
        var age = new List<double>(depth.Capacity);
        var segmentEvent = new List<int>(depth.Capacity);
        double sediment = 0, eventSum = 0;
        int next = 0;
        for (int i = 0; i < agesBP.Length; i++)
        {
            if (i > 0)
            {
                // Trapezoid rule on the annual grid (rate varies smoothly over decades).
                double step = 0.5 * (rate[i - 1] + rate[i]) * (agesBP[i] - agesBP[i - 1]);
                while (next < events.Count && events[next].AgeBP < agesBP[i])
                {
                    var (te, h) = events[next];
                    if (h > 0)
                    {
                        double d = sediment + step * (te - agesBP[i - 1]) / (agesBP[i] - agesBP[i - 1]) + eventSum;
                        segmentEvent.Add(-1);
                        depth.Add(d);
                        age.Add(te);
                        segmentEvent.Add(next);
                        depth.Add(d + h);
                        age.Add(te);
                        eventSum += h;
                    }
                    next++;
                }
                sediment += step;
                segmentEvent.Add(-1);
            }
            depth.Add(sediment + eventSum);
            age.Add(agesBP[i]);
        }
        return new CoreStratigraphy([.. depth], [.. age], [.. segmentEvent], lostTop);
    }

    public double OldestAgeBP => _age[^1];
    public double ColumnBottom => _depth[^1];

    /// <summary>Where a core depth lies: its age, and the event index and fraction (0 top, 1 base) when inside an event layer (else -1).</summary>
    public (double AgeBP, int Event, double Fraction) Locate(double coreDepth)
    {
        double d = Math.Clamp(coreDepth + LostTop, _depth[0], _depth[^1]);
        int k = UpperSegment(_depth, d);
        // The base of an event layer belongs to the layer, so a sample there maps to the base of the same layer elsewhere.
        if (k > 0 && d == _depth[k] && _segmentEvent[k - 1] >= 0) k--;
        int ev = _segmentEvent[k];
        double span = _depth[k + 1] - _depth[k];
        double f = span > 0 ? (d - _depth[k]) / span : 0;
        return ev >= 0 ? (_age[k], ev, f) : (_age[k] + f * (_age[k + 1] - _age[k]), -1, 0);
    }

    public double AgeAt(double coreDepth) => Locate(coreDepth).AgeBP;

    /// <summary>Core depth at an age outside event layers (at an event's age: the top of its layer).</summary>
    public double CoreDepthAtAge(double ageBP)
    {
        double a = Math.Clamp(ageBP, _age[0], _age[^1]);
        int k = UpperSegment(_age, a);
        // Equal ages only occur across an event segment: take the normal segment above it.
        while (k > 0 && _age[k] == a && _segmentEvent[k - 1] >= 0) k--;
        if (_segmentEvent[k] >= 0) return _depth[k] - LostTop;
        double span = _age[k + 1] - _age[k];
        double f = span > 0 ? (a - _age[k]) / span : 0;
        return _depth[k] + f * (_depth[k + 1] - _depth[k]) - LostTop;
    }

    /// <summary>Core depths of an event layer's top and base, or null when the event left no layer in this core.</summary>
    public (double Top, double Base)? LayerOf(int eventIndex)
    {
        int k = Array.IndexOf(_segmentEvent, eventIndex);
        return k < 0 ? null : (_depth[k] - LostTop, _depth[k + 1] - LostTop);
    }

    /// <summary>Last segment index k with xs[k] &lt;= x, kept within [0, n-2].</summary>
    private static int UpperSegment(double[] xs, double x)
    {
        int lo = 0, hi = xs.Length - 1;
        while (hi - lo > 1)
        {
            int mid = (lo + hi) >> 1;
            if (xs[mid] <= x) lo = mid;
            else hi = mid;
        }
        return lo;
    }
}
