namespace StratLink.Alignment;

/// <summary>
/// Local cost d(i, j) between query row i and reference row j (0-based). Implemented by structs so
/// the solvers, generic over the cost type, get the call inlined in their inner loops.
/// </summary>
public interface ILocalCost
{
    double Cost(int i, int j);

    /// <summary>Costs of row i, columns j0 .. j0 + into.Length - 1 (the hot loops fill a row at a time).</summary>
    void Row(int i, int j0, Span<double> into);
}
