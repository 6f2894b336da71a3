namespace StratLink.Alignment;

/// <summary>
/// Local cost d(i, j) between query row i and reference row j (0-based). Implemented by structs so
/// the solvers, generic over the cost type, get the call inlined in their inner loops.
/// </summary>
public interface ILocalCost
{
    double Cost(int i, int j);
}
