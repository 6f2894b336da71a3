using MathNet.Numerics.Distributions;
using StratLink.AgeModelling.Calibration;
using StratLink.Model;

namespace StratLink.AgeModelling;

/// <summary>
/// An age control ready for the Monte Carlo: its points (core and core depth each) and how to draw their
/// ages in one iteration. Calendar ages are normal; radiocarbon ages follow the full calibrated density
/// (inverse CDF); a varve sequence draws its anchor age and one counting-error factor.
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
            double s = varves is null ? (density?.StandardDeviation ?? sigma) : Math.Sqrt(sigma * sigma + Math.Pow(countError * varves.Counts[p], 2));
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

    /// <summary>Draws the ages of every point into <paramref name="ages"/> from <paramref name="rng"/>.</summary>
    public void Draw(Random rng, Span<double> ages)
    {
        if (_varves is not null)
        {
            double anchor = _sigma > 0 ? Normal.InvCDF(_mean, _sigma, OpenUnit(rng)) : _mean;
            double factor = _countError > 0 ? Math.Max(0, 1 + _countError * Normal.InvCDF(0, 1, OpenUnit(rng))) : 1;
            for (int p = 0; p < ages.Length; p++) ages[p] = anchor + _varves.Counts[p] * factor;
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
