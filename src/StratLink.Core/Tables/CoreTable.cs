using StratLink.Quantities;

namespace StratLink.Tables;

/// <summary>
/// The samples of one core: absolute depths (section offsets applied), strictly increasing, in the
/// project unit, and one column of values per signal with NaN where a value is missing.
/// </summary>
public sealed class CoreTable
{
    public CoreTable(string coreId, DepthUnit unit, double[] depths, IReadOnlyDictionary<string, double[]> signals, string? sourceFile = null, int[]? sourceLines = null)
    {
        for (int i = 1; i < depths.Length; i++)
            if (!(depths[i] > depths[i - 1])) throw new ArgumentException($"Depths of core {coreId} must increase (row {i}).", nameof(depths));
        foreach (var (name, values) in signals)
            if (values.Length != depths.Length) throw new ArgumentException($"Signal {name} of core {coreId} has {values.Length} values for {depths.Length} depths.", nameof(signals));
        CoreId = coreId;
        Unit = unit;
        Depths = depths;
        Signals = signals;
        SourceFile = sourceFile;
        SourceLines = sourceLines;
    }

    public string CoreId { get; }
    public DepthUnit Unit { get; }

    /// <summary>Depth of each sample in <see cref="Unit"/>, strictly increasing.</summary>
    public double[] Depths { get; }

    /// <summary>Signal name to values (NaN = missing), aligned with <see cref="Depths"/>, in the file's column order.</summary>
    public IReadOnlyDictionary<string, double[]> Signals { get; }

    public string? SourceFile { get; }

    /// <summary>1-based line of each row in <see cref="SourceFile"/>, for messages.</summary>
    public int[]? SourceLines { get; }

    public int Count => Depths.Length;
    public CoreDepth Top => CoreDepth.From(Count == 0 ? 0 : Depths[0], Unit);
    public CoreDepth Bottom => CoreDepth.From(Count == 0 ? 0 : Depths[^1], Unit);
    public IEnumerable<string> SignalNames => Signals.Keys;
}
