using StratLink.Model;

namespace StratLink.Compositing;

/// <summary>
/// A core's gaps and disturbed intervals merged into sorted, disjoint intervals (ends included, as
/// <see cref="Quantities.DepthInterval.Contains"/>), so ascending depths can be tested in one pass.
/// </summary>
internal sealed class UnusableIntervals
{
    private readonly double[] _tops;
    private readonly double[] _bottoms;

    public UnusableIntervals(CoreSpec spec, Quantities.DepthUnit unit)
    {
        var all = spec.Gaps.Concat(spec.Disturbed)
            .Select(i => (Top: i.Top.In(unit), Bottom: i.Bottom.In(unit)))
            .OrderBy(i => i.Top).ThenBy(i => i.Bottom)
            .ToList();
        var tops = new List<double>();
        var bottoms = new List<double>();
        foreach (var (top, bottom) in all)
        {
            if (tops.Count > 0 && top <= bottoms[^1]) bottoms[^1] = Math.Max(bottoms[^1], bottom);
            else
            {
                tops.Add(top);
                bottoms.Add(bottom);
            }
        }
        _tops = [.. tops];
        _bottoms = [.. bottoms];
    }

    public int Count => _tops.Length;

    /// <summary>A forward-only cursor for non-decreasing depths.</summary>
    public Cursor Start() => new(this);

    public struct Cursor(UnusableIntervals owner)
    {
        private int _j;

        /// <summary>True when <paramref name="depth"/> (not below the previous query) is unusable.</summary>
        public bool IsUnusable(double depth)
        {
            var o = owner;
            while (_j < o._tops.Length && o._bottoms[_j] < depth) _j++;
            return _j < o._tops.Length && o._tops[_j] <= depth;
        }
    }
}
