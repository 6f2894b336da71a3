using StratLink.Model;
using StratLink.Quantities;

namespace StratLink.AgeModelling;

/// <summary>
/// A depth scale with its event layers cut out: an event layer (turbidite, flood bed, thick tephra) is deposited
/// in an instant, so for age modelling each takes the age of its base and lasts no time. The event-free depth of d
/// is d minus the thickness of every event above it (inside an event, the event-free depth of its top and base).
/// Intervals are sorted and disjoint, in one depth unit; with none the scale is the identity.
/// </summary>
public sealed class EventFreeScale
{
    private readonly double[] _tops;
    private readonly double[] _bottoms;

    /// <summary>Cumulative thickness of the events above event k (k = 0 .. Count).</summary>
    private readonly double[] _removedAbove;

    public static readonly EventFreeScale None = new([], []);

    public EventFreeScale(double[] tops, double[] bottoms)
    {
        if (tops.Length != bottoms.Length) throw new ArgumentException("Event tops and bottoms differ in number.");
        _tops = tops;
        _bottoms = bottoms;
        _removedAbove = new double[tops.Length + 1];
        for (int k = 0; k < tops.Length; k++)
        {
            if (!(bottoms[k] >= tops[k])) throw new ArgumentException($"Event {k}: its bottom lies above its top.");
            if (k > 0 && tops[k] < bottoms[k - 1]) throw new ArgumentException($"Event {k} overlaps the event above it.");
            _removedAbove[k + 1] = _removedAbove[k] + (bottoms[k] - tops[k]);
        }
    }

    /// <summary>The events of one core in <paramref name="unit"/> (the reader keeps them sorted and disjoint).</summary>
    public static EventFreeScale Of(CoreSpec core, DepthUnit unit) => core.Events.Count == 0 ? None
        : new([.. core.Events.Select(e => e.Top.In(unit))], [.. core.Events.Select(e => e.Bottom.In(unit))]);

    public int Count => _tops.Length;
    public IReadOnlyList<double> Tops => _tops;
    public IReadOnlyList<double> Bottoms => _bottoms;

    /// <summary>Total thickness of the events.</summary>
    public double TotalThickness => _removedAbove[^1];

    /// <summary>Event-free depth of <paramref name="depth"/>.</summary>
    public double ToEventFree(double depth)
    {
        if (_tops.Length == 0) return depth;
        int k = Above(depth);
        // Events 0..k-1 lie wholly above or contain depth.
        if (k > 0 && depth < _bottoms[k - 1]) return _tops[k - 1] - _removedAbove[k - 1];
        return depth - _removedAbove[k];
    }

    /// <summary>The depth itself, or the base of the event layer holding it (the depth whose age the event takes).</summary>
    public double BaseOf(double depth)
    {
        if (_tops.Length == 0) return depth;
        int k = Above(depth);
        return k > 0 && depth < _bottoms[k - 1] ? _bottoms[k - 1] : depth;
    }

    /// <summary>True when <paramref name="depth"/> lies inside an event layer (top included, base excluded).</summary>
    public bool IsInEvent(double depth)
    {
        int k = Above(depth);
        return k > 0 && depth < _bottoms[k - 1];
    }

    /// <summary>True when <paramref name="depth"/> lies inside an event layer or on its top or base (a sample there holds event material).</summary>
    public bool Covers(double depth)
    {
        int k = Above(depth);
        return k > 0 && depth <= _bottoms[k - 1];
    }

    /// <summary>Number of events whose top lies at or above <paramref name="depth"/>.</summary>
    private int Above(double depth)
    {
        int lo = 0, hi = _tops.Length;
        while (lo < hi)
        {
            int mid = (lo + hi) >>> 1;
            if (_tops[mid] <= depth) lo = mid + 1; else hi = mid;
        }
        return lo;
    }
}
