namespace StratLink.Tests.Alignment;

/// <summary>Seeded random walks (steps uniform in [-0.5, 0.5)): series without exact ties between cells' costs.</summary>
internal static class RandomWalks
{
    public static double[] Walk(Random rng, int n)
    {
        var x = new double[n];
        double v = 0;
        for (int i = 0; i < n; i++) { v += rng.NextDouble() - 0.5; x[i] = v; }
        return x;
    }
}
