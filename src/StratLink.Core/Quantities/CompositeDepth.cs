namespace StratLink.Quantities;

/// <summary>
/// A depth on the site's composite depth scale (the reference core's scale, extended). It never mixes with a
/// <see cref="CoreDepth"/>: moving between the two needs a depth mapping.
/// </summary>
public readonly struct CompositeDepth : IEquatable<CompositeDepth>, IComparable<CompositeDepth>
{
    private readonly double _value;

    private CompositeDepth(double value, DepthUnit unit)
    {
        if (double.IsNaN(value)) throw new ArgumentException("A depth cannot be NaN.", nameof(value));
        _value = value;
        Unit = unit;
    }

    public DepthUnit Unit { get; }

    public static CompositeDepth From(double value, DepthUnit unit) => new(value, unit);

    /// <summary>The depth expressed in <paramref name="unit"/>.</summary>
    public double In(DepthUnit unit) => DepthUnits.Convert(_value, Unit, unit);

    public CompositeDepth Plus(double length, DepthUnit unit) => new(_value + DepthUnits.Convert(length, unit, Unit), Unit);

    /// <summary>Length from <paramref name="other"/> down to this depth, in this depth's unit.</summary>
    public double LengthBelow(CompositeDepth other) => _value - other.In(Unit);

    public static bool operator <(CompositeDepth a, CompositeDepth b) => a.CompareTo(b) < 0;
    public static bool operator >(CompositeDepth a, CompositeDepth b) => a.CompareTo(b) > 0;
    public static bool operator <=(CompositeDepth a, CompositeDepth b) => a.CompareTo(b) <= 0;
    public static bool operator >=(CompositeDepth a, CompositeDepth b) => a.CompareTo(b) >= 0;
    public static bool operator ==(CompositeDepth a, CompositeDepth b) => a.Equals(b);
    public static bool operator !=(CompositeDepth a, CompositeDepth b) => !a.Equals(b);

    public int CompareTo(CompositeDepth other) => _value.CompareTo(other.In(Unit));
    public bool Equals(CompositeDepth other) => _value == other.In(Unit);
    public override bool Equals(object? obj) => obj is CompositeDepth d && Equals(d);
    public override int GetHashCode() => In(DepthUnit.Millimetre).GetHashCode();
    public override string ToString() => DepthUnits.Format(_value, Unit);
}
