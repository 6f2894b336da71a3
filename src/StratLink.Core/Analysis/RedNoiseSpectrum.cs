using MathNet.Numerics.Distributions;
using StratLink.Workflows;

namespace StratLink.Analysis;

/// <summary>
/// Spectrum of an unevenly spaced record against an AR(1) red-noise background (Schulz and Mudelsee 2002,
/// C&amp;G 28:421): persistence on the uneven times, segment-averaged Lomb-Scargle spectrum, theoretical AR(1)
/// spectrum with the same area, bias correction and Monte Carlo levels from AR(1) surrogates on the same
/// times, and chi-square levels G_rr chi2_nu(p)/nu.
/// </summary>
public static class RedNoiseSpectrum
{
    /// <summary>Surrogates per batch: each batch has its own random stream, so results do not depend on threads.</summary>
    private const int BatchSize = 25;

    public static SpectrumEstimate Estimate(AgeSeries series, SpectrumOptions options, int seed,
        IProgress<WorkProgress>? progress = null, CancellationToken cancellationToken = default)
    {
        var layout = SegmentLayout.Of(series.Count, options.Segments);
        var grid = SegmentAveragedPeriodogram.DefaultGrid(series.MeanSpacingYears, layout, options.Oversampling, options.HighestFrequencyFactor);
        var periodogram = new SegmentAveragedPeriodogram(series.TimesForward, layout, options.Taper, grid);
        var raw = periodogram.Compute([series.Values]);
        var persistence = Persistence.Estimate(series.TimesForward, series.Values, options.Segments);
        double variance = Area(raw[0], grid);
        var background = Background(persistence, grid, series.MeanSpacingYears, variance);

        double[] correction = Ones(grid.Count);
        IReadOnlyList<double[]>? mcLevels = null;
        if (options.Surrogates > 0)
        {
            var sims = Surrogates(series, periodogram, persistence.TauYears, options.Surrogates, variance, seed, progress, cancellationToken);
            var mean = new double[grid.Count];
            foreach (var s in sims)
                for (int k = 0; k < grid.Count; k++) mean[k] += s[k];
            Scale(mean, variance / Area(mean, grid));
            for (int k = 0; k < grid.Count; k++) correction[k] = mean[k] / background[k];
            mcLevels = Percentiles(sims, grid.Count, correction);
        }
        return Assemble(series, options, grid, raw[0], correction, background, persistence, mcLevels);
    }

    /// <summary>
    /// The spectrum of one age-model member on the grid of <paramref name="reference"/>, with its own persistence
    /// and background and the reference's bias correction (members share nearly the same sampling), and
    /// chi-square levels.
    /// </summary>
    public static SpectrumEstimate EstimateLike(AgeSeries series, SpectrumOptions options, SpectrumEstimate reference)
    {
        var layout = SegmentLayout.Of(series.Count, options.Segments);
        var periodogram = new SegmentAveragedPeriodogram(series.TimesForward, layout, options.Taper, reference.Grid);
        var raw = periodogram.Compute([series.Values]);
        var persistence = Persistence.Estimate(series.TimesForward, series.Values, options.Segments);
        var background = Background(persistence, reference.Grid, series.MeanSpacingYears, Area(raw[0], reference.Grid));
        return Assemble(series, options, reference.Grid, raw[0], reference.Correction, background, persistence, null);
    }

    private static SpectrumEstimate Assemble(AgeSeries series, SpectrumOptions options, FrequencyGrid grid, double[] raw,
        double[] correction, double[] background, PersistenceEstimate persistence, IReadOnlyList<double[]>? mcLevels)
    {
        double dof = options.Taper.EquivalentDegreesOfFreedom(options.Segments);
        var chi = new List<double[]>();
        foreach (double percent in SignificanceLevels.Percents)
        {
            double factor = ChiSquared.InvCDF(dof, percent / 100) / dof;
            var level = new double[grid.Count];
            for (int k = 0; k < grid.Count; k++) level[k] = background[k] * factor;
            chi.Add(level);
        }
        var power = new double[grid.Count];
        for (int k = 0; k < grid.Count; k++) power[k] = raw[k] / correction[k];
        var f = grid.Frequencies();
        var periods = new double[f.Length];
        for (int k = 0; k < f.Length; k++) periods[k] = 1 / f[k];
        var layout = SegmentLayout.Of(series.Count, options.Segments);
        return new SpectrumEstimate
        {
            Grid = grid,
            Frequencies = f,
            Periods = periods,
            Power = power,
            RawPower = raw,
            Correction = correction,
            Background = background,
            ChiSquareLevels = chi,
            MonteCarloLevels = mcLevels,
            Persistence = persistence,
            DegreesOfFreedom = dof,
            SixDecibelBandwidth = options.Taper.SixDecibelBandwidthBins() / (layout.Length * series.MeanSpacingYears),
            NyquistFrequency = 1 / (2 * series.MeanSpacingYears),
            Segments = options.Segments,
            Taper = options.Taper,
            Surrogates = mcLevels is null ? 0 : options.Surrogates,
        };
    }

    private static double[] Background(PersistenceEstimate persistence, FrequencyGrid grid, double meanSpacing, double variance)
    {
        double nyquist = 1 / (2 * meanSpacing);
        var g = new double[grid.Count];
        for (int k = 0; k < grid.Count; k++) g[k] = Ar1Process.RelativeSpectrum(persistence.Rho, grid.Frequency(k), nyquist);
        Scale(g, variance / Area(g, grid));
        return g;
    }

    private static List<double[]> Surrogates(AgeSeries series, SegmentAveragedPeriodogram periodogram, double tau, int count,
        double variance, int seed, IProgress<WorkProgress>? progress, CancellationToken ct)
    {
        int batches = (count + BatchSize - 1) / BatchSize;
        var results = new double[batches][][];
        int done = 0;
        Parallel.For(0, batches, new ParallelOptions { CancellationToken = ct }, b =>
        {
            var random = DerivedRandom.Create(seed, DerivedRandom.SurrogateStream, b);
            int size = Math.Min(BatchSize, count - b * BatchSize);
            var batch = new double[size][];
            for (int j = 0; j < size; j++)
            {
                batch[j] = new double[series.Count];
                Ar1Process.Simulate(series.TimesForward, tau, random, batch[j]);
            }
            var spectra = periodogram.Compute(batch);
            // Each surrogate is scaled to the data's area, as the background is.
            foreach (var s in spectra) Scale(s, variance / Area(s, periodogram.Grid));
            results[b] = spectra;
            int d = Interlocked.Increment(ref done);
            progress?.Report(new WorkProgress("red-noise surrogates", (double)d / batches));
        });
        return results.SelectMany(r => r).ToList();
    }

    private static List<double[]> Percentiles(List<double[]> sims, int count, double[] correction)
    {
        var levels = SignificanceLevels.Percents.Select(_ => new double[count]).ToList();
        var column = new double[sims.Count];
        for (int k = 0; k < count; k++)
        {
            for (int s = 0; s < sims.Count; s++) column[s] = sims[s][k];
            Array.Sort(column);
            for (int l = 0; l < levels.Count; l++)
                levels[l][k] = Statistics.PercentileSorted(column, SignificanceLevels.Percents[l]) / correction[k];
        }
        return levels;
    }

    private static double Area(double[] g, FrequencyGrid grid)
    {
        double s = 0;
        foreach (double v in g) s += v;
        return s * grid.Step;
    }

    private static void Scale(double[] g, double factor)
    {
        for (int k = 0; k < g.Length; k++) g[k] *= factor;
    }

    private static double[] Ones(int n)
    {
        var a = new double[n];
        Array.Fill(a, 1.0);
        return a;
    }
}
