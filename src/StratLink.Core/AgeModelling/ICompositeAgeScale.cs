using StratLink.Quantities;

namespace StratLink.AgeModelling;

/// <summary>Calendar age along the composite depth scale with its 95 % range, as the age model gives it.</summary>
public interface ICompositeAgeScale
{
    /// <summary>Median age and 2.5/97.5 percentiles, years cal BP, at a composite depth.</summary>
    (double MedianBP, double LoBP, double HiBP) AgeAt(CompositeDepth depth);

    /// <summary><see cref="AgeAt"/> at every one of <paramref name="depths"/> (best in ascending order), into the three spans.</summary>
    void AgesAt(ReadOnlySpan<CompositeDepth> depths, Span<double> medianBP, Span<double> loBP, Span<double> hiBP, CancellationToken ct)
    {
        for (int r = 0; r < depths.Length; r++)
        {
            if ((r & 1023) == 0) ct.ThrowIfCancellationRequested();
            (medianBP[r], loBP[r], hiBP[r]) = AgeAt(depths[r]);
        }
    }

    /// <summary>Number of ensemble members available to <see cref="MemberAgeAt"/>.</summary>
    int MemberCount { get; }

    /// <summary>Age of one ensemble member at a composite depth, years cal BP.</summary>
    double MemberAgeAt(int member, CompositeDepth depth);
}
