namespace StratLink.AgeModelling;

/// <summary>
/// Independent seeds for units of parallel work, derived from the run's seed and the unit's indices by
/// the SplitMix64 finaliser (Steele, Lea and Flood 2014, OOPSLA): results do not depend on which thread
/// runs which unit, so a run is reproducible bit for bit on any number of cores.
/// </summary>
internal static class SeedStreams
{
    public static int Derive(int seed, int first, int second)
    {
        ulong x = Mix((ulong)(uint)seed);
        x = Mix(x ^ (uint)first);
        x = Mix(x ^ ((ulong)(uint)second << 32));
        return (int)(x >> 33);
    }

    private static ulong Mix(ulong z)
    {
        z += 0x9E3779B97F4A7C15UL;
        z = (z ^ (z >> 30)) * 0xBF58476D1CE4E5B9UL;
        z = (z ^ (z >> 27)) * 0x94D049BB133111EBUL;
        return z ^ (z >> 31);
    }
}
