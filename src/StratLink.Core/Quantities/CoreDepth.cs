namespace StratLink.Quantities;

/// <summary>
/// A depth measured along one core (its own drilling or section depth scale). It never mixes with a
/// <see cref="CompositeDepth"/>: moving between the two needs a depth mapping.
/// </summary>
public readonly struct CoreDepth : IEquatable<CoreDepth>, IComparable<CoreDepth>
{
    private readonly double _value;

    private CoreDepth(double value, DepthUnit unit)
    {
        if (double.IsNaN(value)) throw new ArgumentException("A depth cannot be NaN.", nameof(value));
        _value = value;
        Unit = unit;
    }

    public DepthUnit Unit { get; }

    public static CoreDepth From(double value, DepthUnit unit) => new(value, unit);

    /// <summary>The depth expressed in <paramref name="unit"/>.</summary>
    public double In(DepthUnit unit) => DepthUnits.Convert(_value, Unit, unit);

    public CoreDepth Plus(double length, DepthUnit unit) => new(_value + DepthUnits.Convert(length, unit, Unit), Unit);

    /// <summary>Length from <paramref name="other"/> down to this depth, in this depth's unit.</summary>
    public double LengthBelow(CoreDepth other) => _value - other.In(Unit);

    public static bool operator <(CoreDepth a, CoreDepth b) => a.CompareTo(b) < 0;
    public static bool operator >(CoreDepth a, CoreDepth b) => a.CompareTo(b) > 0;
    public static bool operator <=(CoreDepth a, CoreDepth b) => a.CompareTo(b) <= 0;
    public static bool operator >=(CoreDepth a, CoreDepth b) => a.CompareTo(b) >= 0;
    public static bool operator ==(CoreDepth a, CoreDepth b) => a.Equals(b);
    public static bool operator !=(CoreDepth a, CoreDepth b) => !a.Equals(b);

    public int CompareTo(CoreDepth other) => _value.CompareTo(other.In(Unit));
    public bool Equals(CoreDepth other) => _value == other.In(Unit);
    public override bool Equals(object? obj) => obj is CoreDepth d && Equals(d);
    public override int GetHashCode() => In(DepthUnit.Millimetre).GetHashCode();
    public override string ToString() => DepthUnits.Format(_value, Unit);
}
