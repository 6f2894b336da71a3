namespace StratLink.Quantities;

/// <summary>An interval along one core, top above bottom (top &lt;= bottom).</summary>
public readonly struct DepthInterval : IEquatable<DepthInterval>
{
    private DepthInterval(CoreDepth top, CoreDepth bottom)
    {
        Top = top;
        Bottom = bottom;
    }

    public CoreDepth Top { get; }
    public CoreDepth Bottom { get; }

    /// <summary>Builds an interval; throws when <paramref name="top"/> lies below <paramref name="bottom"/>.</summary>
    public static DepthInterval FromTopBottom(CoreDepth top, CoreDepth bottom)
    {
        if (top > bottom) throw new ArgumentException($"Interval top {top} lies below its bottom {bottom}.");
        return new DepthInterval(top, CoreDepth.From(bottom.In(top.Unit), top.Unit));
    }

    public static DepthInterval FromTopBottom(double top, double bottom, DepthUnit unit) =>
        FromTopBottom(CoreDepth.From(top, unit), CoreDepth.From(bottom, unit));

    /// <summary>True when <paramref name="depth"/> lies inside the interval, ends included.</summary>
    public bool Contains(CoreDepth depth) => depth >= Top && depth <= Bottom;

    /// <summary>Same as <see cref="Contains(CoreDepth)"/> for a raw value already in the interval's unit (hot loops).</summary>
    public bool ContainsValue(double depthInUnit) => depthInUnit >= Top.In(Top.Unit) && depthInUnit <= Bottom.In(Top.Unit);

    public double Length => Bottom.LengthBelow(Top);

    public bool Equals(DepthInterval other) => Top == other.Top && Bottom == other.Bottom;
    public override bool Equals(object? obj) => obj is DepthInterval i && Equals(i);
    public override int GetHashCode() => HashCode.Combine(Top, Bottom);
    public static bool operator ==(DepthInterval a, DepthInterval b) => a.Equals(b);
    public static bool operator !=(DepthInterval a, DepthInterval b) => !a.Equals(b);
    public override string ToString() => $"[{Top}, {Bottom}]";
}
