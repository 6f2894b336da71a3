namespace StratLink.Demo;

/// <summary>
/// Independent random streams derived from one seed, one per named part of the generator, so that
/// changing how many numbers one part draws does not shift every other part's draws.
/// </summary>
internal static class SeedStreams
{
    public static Random For(int seed, string stream) => new(DeriveSeed(seed, stream));

    /// <summary>FNV-1a over the stream name mixed with the seed by SplitMix64's finaliser (Steele, Lea and Flood 2014).</summary>
    internal static int DeriveSeed(int seed, string stream)
    {
        ulong h = 14695981039346656037UL;
        foreach (char c in stream)
        {
            h ^= c;
            h *= 1099511628211UL;
        }
        ulong z = h ^ ((ulong)(uint)seed * 0x9E3779B97F4A7C15UL);
        z = (z ^ (z >> 30)) * 0xBF58476D1CE4E5B9UL;
        z = (z ^ (z >> 27)) * 0x94D049BB133111EBUL;
        z ^= z >> 31;
        return (int)(z & 0x7FFFFFFF);
    }
}
