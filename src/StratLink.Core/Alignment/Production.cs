namespace StratLink.Alignment;

/// <summary>
/// One production of a step pattern: it reaches (i, j) from the origin (i - OriginI, j - OriginJ)
/// and adds weight x local cost for each listed cell, given as offsets back from (i, j) in the
/// order from the origin towards (i, j); the last cell is (0, 0).
/// </summary>
public sealed class Production
{
    public Production(int originI, int originJ, Step[] cells)
    {
        if (cells.Length == 0 || cells[^1].BackI != 0 || cells[^1].BackJ != 0)
            throw new ArgumentException("A production must end at the cell it reaches.", nameof(cells));
        OriginI = originI;
        OriginJ = originJ;
        Cells = cells;
        // Angle of the production in the (core, reference) plane: its implied accumulation-rate ratio.
        Angle = Math.Atan2(originJ, originI);
    }

    public int OriginI { get; }
    public int OriginJ { get; }
    public IReadOnlyList<Step> Cells { get; }
    internal Step[] CellArray => (Step[])Cells;

    /// <summary>atan2(dj, di): 0 along the query, pi/2 along the reference, pi/4 on the diagonal.</summary>
    public double Angle { get; }

    /// <summary>A weighted cell of a production, as offsets back from the cell reached.</summary>
    public readonly record struct Step(int BackI, int BackJ, double Weight);
}
