using StratLink.Quantities;

namespace StratLink.Compositing;

/// <summary>
/// The composite depth scale sampled at a fixed step: rows at whole multiples of the step, from the
/// shallowest to the deepest composite depth any core reaches.
/// </summary>
public sealed class CompositeGrid
{
    private readonly double[] _values;

    /// <param name="unit">The project's depth unit.</param>
    /// <param name="step">Row spacing in <paramref name="unit"/>, positive.</param>
    /// <param name="firstIndex">The first row lies at <paramref name="firstIndex"/> times the step.</param>
    /// <param name="count">Number of rows.</param>
    public CompositeGrid(DepthUnit unit, double step, long firstIndex, int count)
    {
        if (!(step > 0)) throw new ArgumentOutOfRangeException(nameof(step), step, "The composite step must be positive.");
        if (count < 0) throw new ArgumentOutOfRangeException(nameof(count));
        Unit = unit;
        Step = step;
        _values = new double[count];
        // Decimal arithmetic keeps rows like 0.3 from printing as 0.30000000000000004.
        decimal s = (decimal)step;
        for (int k = 0; k < count; k++) _values[k] = (double)(s * (firstIndex + k));
    }

    /// <summary>The grid spanning [<paramref name="top"/>, <paramref name="bottom"/>], widened outwards to whole steps.</summary>
    public static CompositeGrid Spanning(DepthUnit unit, double step, double top, double bottom)
    {
        // A relative tolerance stops a bound that is a whole step up to rounding from adding a row.
        const double tolerance = 1e-9;
        long first = (long)Math.Floor(top / step + tolerance);
        long last = (long)Math.Ceiling(bottom / step - tolerance);
        if (last < first) last = first;
        long count = last - first + 1;
        if (count > MaxRows)
            throw new ArgumentException($"A composite from {top} to {bottom} {unit.Symbol()} at step {step} would have {count} rows; choose a larger composite step.");
        return new CompositeGrid(unit, step, first, (int)count);
    }

    /// <summary>Largest grid built (about 80 MB per stacked column set); a larger one means a step in the wrong unit.</summary>
    public const long MaxRows = 10_000_000;

    public DepthUnit Unit { get; }
    public double Step { get; }
    public int Count => _values.Length;

    /// <summary>Row depths in <see cref="Unit"/>, ascending (read-only by convention; hot loops).</summary>
    public ReadOnlySpan<double> Values => _values;

    public double ValueAt(int row) => _values[row];
    public CompositeDepth DepthAt(int row) => CompositeDepth.From(_values[row], Unit);
    public CompositeDepth Top => DepthAt(0);
    public CompositeDepth Bottom => DepthAt(Count - 1);
}
