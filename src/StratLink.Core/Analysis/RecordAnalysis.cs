using System.Globalization;
using StratLink.Checks;
using StratLink.Workflows;

namespace StratLink.Analysis;

/// <summary>
/// Time-series analysis of one dated record: red-noise spectrum with the periods asked for, regime shifts,
/// Gaussian filters, all on the median ages; then spectrum and shifts again on each age-model member (or a
/// seeded sample of them) to show how far the findings survive the age uncertainty.
/// </summary>
public static class RecordAnalysis
{
    public static AnalysisResult Run(AnalysisInput input, AnalysisOptions options, IProgress<WorkProgress>? progress = null,
        CancellationToken cancellationToken = default)
    {
        var findings = new FindingList();
        var series = AgeSeries.Create(input.MedianAges(), input.Values);
        int dropped = input.Values.Length - series.Count;
        if (dropped > 0)
            findings.AddNote("analysis.missing", $"{dropped} of {input.Values.Length} samples of {input.SignalName} have no value or age and are left out.");
        if (options.ShiftCutoffYears is double cutoffYears)
        {
            if (!(cutoffYears > 0) || !double.IsFinite(cutoffYears))
                throw new ArgumentOutOfRangeException(nameof(options), cutoffYears, "The regime test's cut-off must be a positive number of years.");
            int l = series.Count < 2 ? 2 : Math.Max(2, (int)Math.Round(cutoffYears / series.MeanSpacingYears));
            options = options with { Regimes = options.Regimes with { CutoffLength = l } };
        }
        int needed = Math.Max(options.Regimes.CutoffLength + 1, SegmentLayout.MinimumLength * (options.Spectrum.Segments + 1) / 2);
        if (series.Count < needed)
            throw new ArgumentException($"{input.SignalName} has {series.Count} dated values; the analysis needs at least {needed}.");

        progress?.Report(new WorkProgress("spectrum", 0));
        var spectrum = RedNoiseSpectrum.Estimate(series, options.Spectrum, options.Seed, progress, cancellationToken);
        if (spectrum.Persistence.Clamped)
            findings.AddWarning("analysis.persistence", $"The persistence of {input.SignalName} came out at rho >= {Persistence.MaximumRho}; it was held there (tau {Format(spectrum.Persistence.TauYears)} yr). Detrend or shorten the record.");

        progress?.Report(new WorkProgress("regime shifts", 0));
        var regimes = RegimeShiftDetector.Detect(series, options.Regimes);
        var filtered = Filter(series, options);

        EnsembleSpread? ensemble = null;
        var memberPeriodShares = new double?[options.PeriodsYears.Count];
        if (input.MemberCount > 0)
        {
            var members = ChooseMembers(input.MemberCount, options.MaxMembers, options.Seed);
            ensemble = RunMembers(input, members, spectrum, regimes, series, options, memberPeriodShares, progress, cancellationToken);
        }

        var periods = new List<PeriodCheck>();
        for (int i = 0; i < options.PeriodsYears.Count; i++)
        {
            double p = options.PeriodsYears[i];
            var (ratio, peakPeriod) = PeakNear(spectrum, spectrum.Level(95), p);
            if (double.IsNaN(ratio))
                findings.AddWarning("analysis.period-outside", $"Period {Format(p)} yr lies outside the spectrum ({Format(spectrum.Periods[^1])}-{Format(spectrum.Periods[0])} yr).");
            periods.Add(new PeriodCheck(p, peakPeriod, ratio, memberPeriodShares[i]));
        }
        progress?.Report(new WorkProgress("done", 1));
        return new AnalysisResult
        {
            SignalName = input.SignalName,
            ValueUnit = input.ValueUnit,
            Options = options,
            Series = series,
            Spectrum = spectrum,
            Regimes = regimes,
            Filtered = filtered,
            Periods = periods,
            Ensemble = ensemble,
            Findings = findings,
        };
    }

    private static FilteredRecord Filter(AgeSeries series, AnalysisOptions options)
    {
        var t = series.TimesForward;
        double lowSigma = options.LowPassSigmaYears
            ?? (options.PeriodsYears.Count > 0
                ? GaussianFilter.SigmaForHalfPower(1 / (2 * options.PeriodsYears.Max()))
                : GaussianFilter.SigmaForHalfPower(1 / (10 * series.MedianSpacingYears)));
        var low = new GaussianFilterBand(double.PositiveInfinity, lowSigma, 1 / GaussianFilter.HalfPowerFrequency(lowSigma),
            double.PositiveInfinity, GaussianFilter.LowPass(t, series.Values, lowSigma, t));
        var bands = new List<GaussianFilterBand>();
        foreach (double period in options.PeriodsYears)
        {
            double f0 = 1 / period, half = options.BandPassHalfWidth * f0;
            double sigma = GaussianFilter.SigmaForHalfPower(half);
            bands.Add(new GaussianFilterBand(period, sigma, 1 / (f0 + half), f0 - half > 0 ? 1 / (f0 - half) : double.PositiveInfinity,
                GaussianFilter.BandPass(t, series.Values, period, sigma, t)));
        }
        return new FilteredRecord(series.AgesBP, series.Values, low, bands);
    }

    /// <summary>All members when there are few enough, else a seeded sample without replacement, in increasing order.</summary>
    private static int[] ChooseMembers(int count, int max, int seed)
    {
        var all = Enumerable.Range(0, count).ToArray();
        if (count <= max) return all;
        var random = DerivedRandom.Create(seed, DerivedRandom.MemberSampleStream, 0);
        for (int i = 0; i < max; i++)
        {
            int j = random.Next(i, count);
            (all[i], all[j]) = (all[j], all[i]);
        }
        var chosen = all[..max];
        Array.Sort(chosen);
        return chosen;
    }

    private static EnsembleSpread RunMembers(AnalysisInput input, int[] members, SpectrumEstimate reference, RegimeShiftResult medianRegimes,
        AgeSeries medianSeries, AnalysisOptions options, double?[] periodShares, IProgress<WorkProgress>? progress, CancellationToken ct)
    {
        int nf = reference.Grid.Count;
        var above = new bool[members.Length][];
        var periodAbove = new bool[members.Length][];
        var shiftAges = new double[members.Length][];
        int done = 0;
        // Members draw no random numbers (chi-square levels, no surrogates), so the parallel loop is deterministic.
        Parallel.For(0, members.Length, new ParallelOptions { CancellationToken = ct }, m =>
        {
            var series = AgeSeries.Create(input.MemberAges(members[m]), input.Values);
            var s = RedNoiseSpectrum.EstimateLike(series, options.Spectrum, reference);
            var level = s.ChiSquareLevels[SignificanceLevels.IndexOf(95)];
            above[m] = new bool[nf];
            for (int k = 0; k < nf; k++) above[m][k] = s.Power[k] > level[k];
            periodAbove[m] = options.PeriodsYears.Select(p => PeakNear(s, level, p).Ratio > 1).ToArray();
            shiftAges[m] = RegimeShiftDetector.Detect(series, options.Regimes).Shifts.Select(x => x.AgeBP).ToArray();
            int d = Interlocked.Increment(ref done);
            progress?.Report(new WorkProgress("age-model members", (double)d / members.Length));
        });

        var share = new double[nf];
        for (int k = 0; k < nf; k++) share[k] = above.Count(a => a[k]) / (double)members.Length;
        for (int i = 0; i < periodShares.Length; i++) periodShares[i] = periodAbove.Count(a => a[i]) / (double)members.Length;

        double window = options.ShiftMatchWindowYears ?? options.Regimes.CutoffLength * medianSeries.MedianSpacingYears;
        var spreads = new List<ShiftSpread>();
        foreach (var shift in medianRegimes.Shifts)
        {
            var matched = new List<double>();
            foreach (var ages in shiftAges)
            {
                double best = double.NaN;
                foreach (double a in ages)
                    if (Math.Abs(a - shift.AgeBP) <= window && (double.IsNaN(best) || Math.Abs(a - shift.AgeBP) < Math.Abs(best - shift.AgeBP))) best = a;
                if (!double.IsNaN(best)) matched.Add(best);
            }
            matched.Sort();
            spreads.Add(new ShiftSpread(shift,
                Statistics.PercentileSorted(matched.ToArray(), 2.5), Statistics.PercentileSorted(matched.ToArray(), 97.5),
                matched.Count / (double)members.Length, window));
        }
        return new EnsembleSpread(members, share, spreads);
    }

    /// <summary>Largest power/level ratio within half the 6-dB bandwidth of 1/period (NaN when the period is off the grid) and the period where it occurs.</summary>
    internal static (double Ratio, double PeakPeriod) PeakNear(SpectrumEstimate s, double[] level, double period)
    {
        double f0 = 1 / period, half = 0.5 * s.SixDecibelBandwidth;
        double best = double.NaN, at = double.NaN;
        for (int k = 0; k < s.Frequencies.Length; k++)
        {
            if (Math.Abs(s.Frequencies[k] - f0) > half) continue;
            double r = s.Power[k] / level[k];
            if (double.IsNaN(best) || r > best) { best = r; at = s.Periods[k]; }
        }
        return (best, at);
    }

    private static string Format(double v) => v.ToString("0.##", CultureInfo.InvariantCulture);
}
