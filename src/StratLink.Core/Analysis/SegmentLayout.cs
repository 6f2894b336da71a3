namespace StratLink.Analysis;

/// <summary>
/// Segments of equal sample count overlapping by half (Welch 1967), as used for segment-averaged
/// spectra and persistence (Schulz and Mudelsee 2002): n segments of floor(2N/(n+1)) samples.
/// </summary>
internal readonly record struct SegmentLayout(int Length, int[] Starts)
{
    /// <summary>Smallest segment length accepted: the bias correction of the persistence divides by length - 4.</summary>
    public const int MinimumLength = 8;

    public static SegmentLayout Of(int sampleCount, int segments)
    {
        if (segments < 1) throw new ArgumentOutOfRangeException(nameof(segments), segments, "At least one segment is needed.");
        int length = 2 * sampleCount / (segments + 1);
        if (segments == 1) length = sampleCount;
        if (length < MinimumLength)
            throw new ArgumentException($"{sampleCount} samples in {segments} half-overlapping segments leave {length} samples per segment; at least {MinimumLength} are needed.");
        var starts = new int[segments];
        for (int i = 0; i < segments; i++) starts[i] = i * length / 2;
        return new SegmentLayout(length, starts);
    }

    /// <summary>Removes the least-squares straight line through (t, y) from <paramref name="y"/>.</summary>
    public static void Detrend(ReadOnlySpan<double> t, Span<double> y)
    {
        int n = t.Length;
        double mt = 0, my = 0;
        for (int i = 0; i < n; i++) { mt += t[i]; my += y[i]; }
        mt /= n;
        my /= n;
        double stt = 0, sty = 0;
        for (int i = 0; i < n; i++)
        {
            stt += (t[i] - mt) * (t[i] - mt);
            sty += (t[i] - mt) * (y[i] - my);
        }
        double slope = stt > 0 ? sty / stt : 0;
        for (int i = 0; i < n; i++) y[i] -= my + slope * (t[i] - mt);
    }
}
