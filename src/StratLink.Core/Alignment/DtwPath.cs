namespace StratLink.Alignment;

/// <summary>
/// An optimal warping path and its cost. Cells are 0-based (query row, reference column), from the
/// first cell to the last, intermediate cells of multi-step productions included; <see cref="StepEndsI"/>
/// and <see cref="StepEndsJ"/> hold only the end points of the productions taken.
/// </summary>
public sealed class DtwPath
{
    internal DtwPath(int[] i, int[] j, int[] stepEndsI, int[] stepEndsJ, double distance, double normalisedDistance, int endColumn)
    {
        I = i;
        J = j;
        StepEndsI = stepEndsI;
        StepEndsJ = stepEndsJ;
        Distance = distance;
        NormalisedDistance = normalisedDistance;
        EndColumn = endColumn;
    }

    public int[] I { get; }
    public int[] J { get; }
    public int[] StepEndsI { get; }
    public int[] StepEndsJ { get; }

    /// <summary>Accumulated cost of the path (not normalised, also under open end).</summary>
    public double Distance { get; }

    /// <summary>Distance over the pattern's normaliser; NaN for patterns that have none.</summary>
    public double NormalisedDistance { get; }

    /// <summary>0-based reference column matched by the query's last row.</summary>
    public int EndColumn { get; }

    public int Length => I.Length;
}
