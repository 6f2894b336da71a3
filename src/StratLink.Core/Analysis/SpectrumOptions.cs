namespace StratLink.Analysis;

/// <summary>Settings of the red-noise spectrum.</summary>
public sealed record SpectrumOptions
{
    /// <summary>Half-overlapping segments averaged (n50 of Schulz and Mudelsee 2002).</summary>
    public int Segments { get; init; } = 3;

    public TaperWindow Taper { get; init; } = TaperWindow.Welch;

    /// <summary>Frequency step = 1 / (oversampling * segment duration).</summary>
    public double Oversampling { get; init; } = 4;

    /// <summary>Highest frequency as a multiple of the mean Nyquist frequency 1/(2 dbar).</summary>
    public double HighestFrequencyFactor { get; init; } = 1;

    /// <summary>AR(1) surrogates on the same times for the bias correction and Monte Carlo levels; 0 = chi-square levels only.</summary>
    public int Surrogates { get; init; } = 1000;
}
