using StratLink.Quantities;

namespace StratLink.Tables;

/// <summary>
/// Depth intervals from a table, one per row (a varve table: one row per counted varve), sorted by
/// top, each top above its bottom, none overlapping the next. Depths in <see cref="Unit"/>.
/// </summary>
public sealed class IntervalTable
{
    internal IntervalTable(DepthUnit unit, double[] tops, double[] bottoms, string sourceFile, int[] sourceLines)
    {
        Unit = unit;
        Tops = tops;
        Bottoms = bottoms;
        SourceFile = sourceFile;
        SourceLines = sourceLines;
    }

    public DepthUnit Unit { get; }
    public double[] Tops { get; }
    public double[] Bottoms { get; }
    public string SourceFile { get; }

    /// <summary>1-based file line of each interval, for messages.</summary>
    public int[] SourceLines { get; }

    public int Count => Tops.Length;

    public DepthInterval this[int index] => DepthInterval.FromTopBottom(Tops[index], Bottoms[index], Unit);
}
