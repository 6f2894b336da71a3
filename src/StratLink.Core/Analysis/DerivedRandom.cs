namespace StratLink.Analysis;

/// <summary>
/// Independent, reproducible random streams for parallel work: each unit of work (a surrogate batch, the
/// choice of age-model members) gets its own <see cref="Random"/> seeded from the run seed, a stream number and its
/// index through SplitMix64 (Steele, Lea and Flood 2014), so results do not depend on thread scheduling.
/// </summary>
internal static class DerivedRandom
{
    public const int SurrogateStream = 1;
    public const int MemberSampleStream = 2;

    public static Random Create(int seed, int stream, int index) => new(DeriveSeed(seed, stream, index));

    public static int DeriveSeed(int seed, int stream, int index)
    {
        ulong z = Mix((ulong)(uint)seed);
        z = Mix(z ^ (ulong)(uint)stream);
        z = Mix(z ^ (ulong)(uint)index);
        return (int)(z & 0x7FFFFFFF);
    }

    private static ulong Mix(ulong x)
    {
        x += 0x9E3779B97F4A7C15UL;
        x = (x ^ (x >> 30)) * 0xBF58476D1CE4E5B9UL;
        x = (x ^ (x >> 27)) * 0x94D049BB133111EBUL;
        return x ^ (x >> 31);
    }
}
