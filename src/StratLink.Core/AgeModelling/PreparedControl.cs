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
