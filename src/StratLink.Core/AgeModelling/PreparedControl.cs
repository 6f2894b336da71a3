using MathNet.Numerics.Distributions;
using StratLink.AgeModelling.Calibration;
using StratLink.Model;

namespace StratLink.AgeModelling;

/// <summary>
/// An age control ready for the Monte Carlo: its points (core and core depth each) and how to draw their
/// ages in one iteration. Calendar ages are normal; radiocarbon ages follow the full calibrated density
/// (inverse CDF); a varve sequence draws its anchor age, a random-walk counting-error path and (when given) one
/// systematic counting-error factor. It also gives the likelihood of a modelled age at its depth, as a control
/// and as an outlier (see <see cref="AgeModeller"/>).
/// </summary>
internal sealed class PreparedControl
{
    private readonly double _mean;
    private readonly double _sigma;
    private readonly CalibratedDensity? _density;
    private readonly VarveSequence? _varves;
    private readonly double _countError;

    private PreparedControl(AgeControlSpec spec, string[] cores, double[] depths, double mean, double sigma, CalibratedDensity? density, VarveSequence? varves, double countError)
    {
        Spec = spec;
        PointCores = cores;
        PointDepths = depths;
        _mean = mean;
        _sigma = sigma;
        _density = density;
        _varves = varves;
        _countError = countError;
        Density = density ?? (varves is null ? NormalDensity(mean, sigma) : null);
        Weights = new double[depths.Length];
        for (int p = 0; p < depths.Length; p++)
        {
            double s = varves is null ? (density?.StandardDeviation ?? sigma) : Math.Sqrt(sigma * sigma + varves.Variances[p] + Math.Pow(countError * varves.Counts[p], 2));
            // Floor at half a year: an exactly known age still gets a finite weight when pooled.
            s = Math.Max(s, 0.5);
            Weights[p] = 1 / (s * s);
        }
    }

    public AgeControlSpec Spec { get; }
    public string Id => Spec.Id;

    /// <summary>Core of each point.</summary>
    public string[] PointCores { get; }

    /// <summary>Core depth of each point, project unit.</summary>
    public double[] PointDepths { get; }

    /// <summary>1/sigma^2 of each point's age, for pooling ages that no ordered draw could separate.</summary>
    public double[] Weights { get; }

    public int PointCount => PointDepths.Length;

    /// <summary>A calendar age attached to a marker layer (its points are the marker's depth in each core).</summary>
    public bool IsMarker => Spec is CalendarAgeControl { Marker: not null };

    /// <summary>The density shown in summaries (calibrated, or a normal calendar age on whole years); null for varves.</summary>
    public CalibratedDensity? Density { get; }

    public CalibrationResult? Calibration { get; init; }

    public static PreparedControl Calendar(AgeControlSpec spec, string[] cores, double[] depths, double ageBP, double sigma) =>
        new(spec, cores, depths, ageBP, sigma, null, null, 0);

    public static PreparedControl Radiocarbon(RadiocarbonAgeControl spec, double depth, CalibrationResult calibration) =>
        new(spec, [spec.Core], [depth], calibration.Density!.Mean, calibration.Density.StandardDeviation, calibration.Density, null, 0) { Calibration = calibration };

    public static PreparedControl Varve(VarveCountControl spec, VarveSequence sequence) =>
        new(spec, Enumerable.Repeat(spec.Core, sequence.Depths.Length).ToArray(), sequence.Depths, spec.AnchorAge.YearsBP, spec.AnchorError, null, sequence, spec.CountError);

    public VarveSequence? Varves => _varves;

    /// <summary>Systematic relative counting error of a varve count (0 = none).</summary>
    public double CountError => _countError;

    /// <summary>Anchor age of a varve count (cal BP) and its 1 sigma.</summary>
    public (double Age, double Sigma) Anchor => (_mean, _sigma);

    /// <summary>Prior probability that the control is an outlier.</summary>
    public double OutlierPrior => Spec.OutlierPrior;

    /// <summary>1 sigma of placing the control's depth on the composite scale (project unit): a marker's pick uncertainty, else half a composite step.</summary>
    public double DepthSigma { get; private set; }

    /// <summary>Sets <see cref="DepthSigma"/> (while preparing, before any iteration reads it).</summary>
    public PreparedControl Placed(double depthSigma)
    {
        DepthSigma = depthSigma;
        return this;
    }

    /// <summary>
    /// An outlier's age says nothing about its depth within a broad range: its likelihood is the control's own
    /// distribution widened by this many years (1 sigma, added in quadrature). Our choice, in the spirit of the
    /// general outlier model of Bronk Ramsey 2009 (Radiocarbon 51:1023-1045, from memory), whose outlier shifts
    /// reach thousands of years.
    /// </summary>
    public const double OutlierWidthYears = 1000;

    /// <summary>Mean and 1 sigma of the control's age (calibrated density's moments for radiocarbon).</summary>
    public (double Mean, double Sigma) Moments => _density is not null ? (_density.Mean, _density.StandardDeviation) : (_mean, _sigma);

    /// <summary>
    /// Log-likelihood of a modelled age at the control's (single) point, given the curve's slope there (yr per
    /// unit), as a true control (<paramref name="outlier"/> false) or as an outlier. Calendar ages: normal, widened
    /// by the depth placement (slope x <see cref="DepthSigma"/>); radiocarbon: the calibrated density on whole
    /// years, linearly interpolated (placement is small beside calibrated ranges and is left out).
    /// </summary>
    public double LogLikelihood(double modelledAge, double yearsPerUnit, bool outlier)
    {
        double place = yearsPerUnit * DepthSigma;
        var (mean, sigma) = Moments;
        if (outlier) return LogNormal(modelledAge, mean, Math.Sqrt(sigma * sigma + place * place + OutlierWidthYears * OutlierWidthYears));
        if (_density is null) return LogNormal(modelledAge, mean, Math.Max(Math.Sqrt(sigma * sigma + place * place), 0.5));
        double x = modelledAge - _density.StartBP;
        int k = (int)Math.Floor(x);
        var p = _density.Probabilities;
        double f = x - k;
        double a = k >= 0 && k < p.Count ? p[k] : 0, b = k + 1 >= 0 && k + 1 < p.Count ? p[k + 1] : 0;
        return Math.Log(Math.Max((1 - f) * a + f * b, 1e-300));
    }

    public static double LogNormal(double x, double mean, double sigma)
    {
        double z = (x - mean) / sigma;
        return -0.5 * z * z - Math.Log(sigma) - 0.5 * Math.Log(2 * Math.PI);
    }

    /// <summary>Draws the ages of every point into <paramref name="ages"/> from <paramref name="rng"/>.</summary>
    public void Draw(Random rng, Span<double> ages)
    {
        if (_varves is not null)
        {
            double anchor = _sigma > 0 ? Normal.InvCDF(_mean, _sigma, OpenUnit(rng)) : _mean;
            double factor = _countError > 0 ? Math.Max(0, 1 + _countError * Normal.InvCDF(0, 1, OpenUnit(rng))) : 1;
            // The counting-error path walks away from the anchor in both directions (counts below and above it).
            var counts = _varves.Counts;
            var variances = _varves.Variances;
            int start = Array.FindIndex(counts, c => c >= 0);
            if (start < 0) start = counts.Length;
            double error = 0, previous = 0;
            for (int p = start; p < counts.Length; p++)
            {
                error += Normal.InvCDF(0, 1, OpenUnit(rng)) * Math.Sqrt(Math.Max(0, variances[p] - previous));
                previous = variances[p];
                ages[p] = anchor + counts[p] * factor + error;
            }
            error = 0;
            previous = 0;
            for (int p = start - 1; p >= 0; p--)
            {
                error += Normal.InvCDF(0, 1, OpenUnit(rng)) * Math.Sqrt(Math.Max(0, variances[p] - previous));
                previous = variances[p];
                ages[p] = anchor + counts[p] * factor + error;
            }
            // A path that lost more years than a point span holds would run backwards: keep each count's ages in order.
            for (int p = 1; p < ages.Length; p++) if (ages[p] < ages[p - 1]) ages[p] = ages[p - 1];
            return;
        }
        double age = _density is not null ? _density.InverseCdf(OpenUnit(rng))
            : _sigma > 0 ? Normal.InvCDF(_mean, _sigma, OpenUnit(rng))
            : _mean;
        ages.Fill(age);
    }

    /// <summary>A calendar-age observation of a varve count's path at one of its points, from another control.</summary>
    /// <param name="Point">Index of the count's point nearest the observing control.</param>
    /// <param name="AgeBP">The control's age at that depth.</param>
    /// <param name="Sigma">Its 1 sigma with the depth placement.</param>
    /// <param name="Prior">The control's prior outlier probability.</param>
    public readonly record struct PathObservation(int Point, double AgeBP, double Sigma, double Prior, int Control);

    /// <summary>
    /// Draws a varve count's ages like <see cref="Draw"/>, with its counting-error path below the anchor drawn
    /// given calendar observations (forward filtering, backward sampling of the random walk: Carter and Kohn 1994,
    /// Biometrika 81:541-553; Fruehwirth-Schnatter 1994, J. Time Ser. Anal. 15:183-202; from memory). At each
    /// observation the control's outlier indicator is drawn from its probability given the path so far (an
    /// outlier's sigma widened by <see cref="OutlierWidthYears"/>), and the member's log weight gains the log of the
    /// predictive density, (1 - p) N(y; m, P + r^2) + p N(y; m, P + r^2 + W^2): every member is kept, weighted
    /// by how well the count and the controls agree. <paramref name="outliers"/> gets each observation's indicator.
    /// Observations must come sorted by point.
    /// </summary>
    public double DrawConditioned(Random rng, Span<double> ages, IReadOnlyList<PathObservation> observations, Span<bool> outliers)
    {
        var counts = _varves!.Counts;
        var variances = _varves.Variances;
        double factor = _countError > 0 ? Math.Max(0, 1 + _countError * Normal.InvCDF(0, 1, OpenUnit(rng))) : 1;
        int start = Array.FindIndex(counts, c => c >= 0);
        if (start < 0) start = counts.Length;
        int n = counts.Length - start;
        // State: anchor offset plus counting error at each point below the anchor, prior x_0 ~ N(0, anchor sigma^2 + V_0).
        var mean = new double[n];
        var variance = new double[n];
        double m = 0, pv = _sigma * _sigma, logWeight = 0, previousV = 0;
        int o = 0;
        for (int k = 0; k < n; k++)
        {
            pv += Math.Max(0, variances[start + k] - previousV);
            previousV = variances[start + k];
            for (; o < observations.Count && observations[o].Point == start + k; o++)
            {
                var ob = observations[o];
                double y = ob.AgeBP - (_mean + counts[start + k] * factor);
                double r2 = ob.Sigma * ob.Sigma, w2 = OutlierWidthYears * OutlierWidthYears;
                double li = Math.Log(1 - ob.Prior) + LogNormal(y, m, Math.Sqrt(pv + r2));
                double lo = ob.Prior > 0 ? Math.Log(ob.Prior) + LogNormal(y, m, Math.Sqrt(pv + r2 + w2)) : double.NegativeInfinity;
                double top = Math.Max(li, lo), log = top + Math.Log(Math.Exp(li - top) + Math.Exp(lo - top));
                logWeight += log;
                bool outlier = rng.NextDouble() < Math.Exp(lo - log);
                outliers[o] = outlier;
                double s2 = outlier ? r2 + w2 : r2, gain = pv / (pv + s2);
                m += gain * (y - m);
                pv *= 1 - gain;
            }
            mean[k] = m;
            variance[k] = pv;
        }
        // Backward sampling.
        double next = 0;
        for (int k = n - 1; k >= 0; k--)
        {
            double mk = mean[k], vk = variance[k];
            if (k < n - 1)
            {
                double q = Math.Max(0, variances[start + k + 1] - variances[start + k]);
                double g = vk + q > 0 ? vk / (vk + q) : 0;
                mk += g * (next - mk);
                vk *= 1 - g;
            }
            next = mk + Math.Sqrt(Math.Max(0, vk)) * Normal.InvCDF(0, 1, OpenUnit(rng));
            ages[start + k] = _mean + counts[start + k] * factor + next;
        }
        // Above the anchor: the unconditioned walk, from the anchor's drawn offset.
        double error = n > 0 ? ages[start] - (_mean + counts[start] * factor) : _sigma > 0 ? _sigma * Normal.InvCDF(0, 1, OpenUnit(rng)) : 0, prev = 0;
        for (int p = start - 1; p >= 0; p--)
        {
            error += Normal.InvCDF(0, 1, OpenUnit(rng)) * Math.Sqrt(Math.Max(0, variances[p] - prev));
            prev = variances[p];
            ages[p] = _mean + counts[p] * factor + error;
        }
        for (int p = 1; p < ages.Length; p++) if (ages[p] < ages[p - 1]) ages[p] = ages[p - 1];
        return logWeight;
    }

    /// <summary>Uniform on (0, 1): the normal inverse CDF is infinite at 0.</summary>
    private static double OpenUnit(Random rng)
    {
        double u;
        do u = rng.NextDouble(); while (u == 0);
        return u;
    }

    /// <summary>A normal age on whole years (each year's probability the normal mass within +- 0.5 yr), for summaries.</summary>
    private static CalibratedDensity NormalDensity(double mean, double sigma)
    {
        if (sigma < 1e-9) return new CalibratedDensity((int)Math.Round(mean), [1.0]);
        int from = (int)Math.Floor(mean - 6 * sigma - 1), to = (int)Math.Ceiling(mean + 6 * sigma + 1);
        var w = new double[to - from + 1];
        for (int k = 0; k < w.Length; k++)
            w[k] = Normal.CDF(mean, sigma, from + k + 0.5) - Normal.CDF(mean, sigma, from + k - 0.5);
        return new CalibratedDensity(from, w);
    }
}
