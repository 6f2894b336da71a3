using StratLink.AgeModelling;
using StratLink.Checks;

namespace StratLink.Tests.AgeModelling;

public class StratigraphicOrderTests
{
    [Fact]
    public void PoolingGivesTheIsotonicFit()
    {
        // Pool-adjacent-violators (Ayer et al. 1955): [1, 3, 2, 4] with equal weights -> [1, 2.5, 2.5, 4];
        // weights 1 and 3 on the violating pair pool to (3 x 1 + 2 x 3) / 4 = 2.25.
        double[] ages = [1, 3, 2, 4];
        StratigraphicOrder.Pool([0, 1, 2, 3], ages, [1, 1, 1, 1]);
        Assert.Equal([1, 2.5, 2.5, 4], ages);
        double[] weighted = [1, 3, 2, 4];
        StratigraphicOrder.Pool([0, 1, 2, 3], weighted, [1, 1, 3, 1]);
        Assert.Equal([1, 2.25, 2.25, 4], weighted);
        Assert.True(StratigraphicOrder.IsOrdered([0, 1, 2, 3], [0, 1, 2, 3], weighted));
    }

    [Fact]
    public void OrderAllowsAnyAgesAtOneDepth()
    {
        Assert.True(StratigraphicOrder.IsOrdered([0, 1, 2], [5, 5, 6], [20, 10, 30]));
        Assert.False(StratigraphicOrder.IsOrdered([0, 1, 2], [5, 5, 6], [20, 10, 15]));
    }

    [Fact]
    public void ConflictComparesWithNearestPointsAboveAndBelow()
    {
        double[] varveZ = [0, 1, 2, 3], varveAge = [0, 10, 20, 30];
        Assert.False(StratigraphicOrder.Conflict([1.5], [15], varveZ, varveAge));
        Assert.True(StratigraphicOrder.Conflict([1.5], [25], varveZ, varveAge));
        Assert.True(StratigraphicOrder.Conflict(varveZ, varveAge, [1.5], [5]));
        Assert.False(StratigraphicOrder.Conflict([2], [20.5], varveZ, varveAge));
    }

    [Fact]
    public void VarveCountsRunFromTheAnchor()
    {
        // Anchor halfway through the third varve: the count there is 2.5, so the first top is -2.5 varves (younger).
        var seq = VarveSequence.Build("v", [0, 1, 2, 3], [1, 2, 3, 4], 2.5, new FindingList())!;
        Assert.Equal([0.0, 1, 2, 3, 4], seq.Depths);
        Assert.Equal([-2.5, -1.5, -0.5, 0.5, 1.5], seq.Counts);
        // In a gap between varves the count is that of the next varve.
        var gap = VarveSequence.Build("v", [0, 2], [1, 3], 1.5, new FindingList())!;
        Assert.Equal([-1.0, 0, 1], gap.Counts);
        // Long sequences are thinned to at most MaxPoints points, keeping both ends.
        var tops = Enumerable.Range(0, 1000).Select(k => (double)k).ToArray();
        var thin = VarveSequence.Build("v", tops, tops.Select(t => t + 1).ToArray(), 0, new FindingList())!;
        Assert.True(thin.Depths.Length <= VarveSequence.MaxPoints);
        Assert.Equal(1000, thin.Counts[^1]);
        Assert.Equal(1000, thin.VarveCount);
    }
}
