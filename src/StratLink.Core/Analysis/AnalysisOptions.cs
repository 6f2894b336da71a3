namespace StratLink.Analysis;

/// <summary>Settings of <see cref="RecordAnalysis.Run"/>.</summary>
public sealed record AnalysisOptions
{
    /// <summary>Seed of every random choice (surrogates, member sample); recorded in the outputs.</summary>
    public int Seed { get; init; } = 1;

    public SpectrumOptions Spectrum { get; init; } = new();
    public RegimeShiftOptions Regimes { get; init; } = new();

    /// <summary>
    /// Cut-off length of the regime test in years; when set it replaces <see cref="RegimeShiftOptions.CutoffLength"/>
    /// with round(years / mean spacing of the median-age record), at least 2 samples, the same l for every member.
    /// The mean spacing (span / (n - 1)) is used so that l samples cover the stated years on average.
    /// </summary>
    public double? ShiftCutoffYears { get; init; }

    /// <summary>Periods of interest, years (e.g. 11 and 88): checked in the spectrum and band-passed.</summary>
    public IReadOnlyList<double> PeriodsYears { get; init; } = [];

    /// <summary>Half-power half-width of each band-pass as a fraction of its centre frequency.</summary>
    public double BandPassHalfWidth { get; init; } = 0.2;

    /// <summary>
    /// Kernel sigma of the low-pass, years. Null: half power at twice the longest period asked for, or at
    /// ten median spacings when none is.
    /// </summary>
    public double? LowPassSigmaYears { get; init; }

    /// <summary>Age-model members analysed at most; a seeded sample is drawn when the ensemble is larger.</summary>
    public int MaxMembers { get; init; } = 200;

    /// <summary>How far (years) a member's shift may lie from a median-run shift and still count as the same; null = l median spacings.</summary>
    public double? ShiftMatchWindowYears { get; init; }

    /// <summary>
    /// The settings both front ends start from for a composite of a multi-centennial to millennial
    /// record: the regime test's long-record defaults (see <see cref="RegimeShiftOptions"/>).
    /// </summary>
    public static AnalysisOptions ForCompositeRecord(int seed, IReadOnlyList<double> periodsYears) => new()
    {
        Seed = seed,
        PeriodsYears = periodsYears,
        ShiftCutoffYears = RegimeShiftOptions.LongRecordCutoffYears,
        Regimes = new RegimeShiftOptions { Probability = RegimeShiftOptions.LongRecordProbability, HuberParameter = RegimeShiftOptions.LongRecordHuber },
    };
}
