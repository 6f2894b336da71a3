namespace StratLink.Alignment;

/// <summary>
/// Seeds for independent units of parallel work, derived from the run's seed and the unit's name
/// and number only, so results do not depend on scheduling or on the order of the other units.
/// </summary>
internal static class Seeds
{
    public static int Derive(int seed, string name, int part)
    {
        // FNV-1a over the name (string.GetHashCode is randomised per process), then SplitMix64 mixing.
        ulong h = 14695981039346656037UL;
        foreach (char c in name) { h ^= c; h *= 1099511628211UL; }
        ulong z = h ^ ((ulong)(uint)seed << 32) ^ (uint)part;
        z += 0x9E3779B97F4A7C15UL;
        z = (z ^ (z >> 30)) * 0xBF58476D1CE4E5B9UL;
        z = (z ^ (z >> 27)) * 0x94D049BB133111EBUL;
        z ^= z >> 31;
        return (int)(z & 0x7FFFFFFF);
    }
}
