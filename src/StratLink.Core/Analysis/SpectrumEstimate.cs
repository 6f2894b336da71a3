namespace StratLink.Analysis;

/// <summary>
/// A segment-averaged Lomb-Scargle spectrum with its AR(1) background and false-alarm levels (one array per
/// entry of <see cref="SignificanceLevels.Percents"/>). Powers are in value^2 * years.
/// </summary>
public sealed record SpectrumEstimate
{
    public required FrequencyGrid Grid { get; init; }

    /// <summary>Cycles per year.</summary>
    public required double[] Frequencies { get; init; }

    /// <summary>Years.</summary>
    public required double[] Periods { get; init; }

    /// <summary>Spectrum after the Lomb-Scargle bias correction (equal to <see cref="RawPower"/> without one).</summary>
    public required double[] Power { get; init; }

    public required double[] RawPower { get; init; }

    /// <summary>Mean surrogate spectrum over the theoretical one, the bias the uneven sampling adds; all 1 without surrogates.</summary>
    public required double[] Correction { get; init; }

    /// <summary>Theoretical AR(1) spectrum, area scaled to the data spectrum.</summary>
    public required double[] Background { get; init; }

    public required IReadOnlyList<double[]> ChiSquareLevels { get; init; }

    /// <summary>Percentiles of the surrogate spectra, bias corrected; null without surrogates.</summary>
    public IReadOnlyList<double[]>? MonteCarloLevels { get; init; }

    public required PersistenceEstimate Persistence { get; init; }
    public required double DegreesOfFreedom { get; init; }

    /// <summary>Full 6-dB bandwidth of the segment taper, cycles per year: the resolution.</summary>
    public required double SixDecibelBandwidth { get; init; }

    /// <summary>1/(2 dbar), cycles per year.</summary>
    public required double NyquistFrequency { get; init; }

    public required int Segments { get; init; }
    public required TaperWindow Taper { get; init; }
    public required int Surrogates { get; init; }

    /// <summary>The level used for decisions: Monte Carlo when surrogates were run, chi-square otherwise.</summary>
    public double[] Level(double percent)
    {
        int i = SignificanceLevels.IndexOf(percent);
        return MonteCarloLevels is { } mc ? mc[i] : ChiSquareLevels[i];
    }

    public string LevelSource => MonteCarloLevels is null ? "chi-square" : "Monte Carlo";
}
