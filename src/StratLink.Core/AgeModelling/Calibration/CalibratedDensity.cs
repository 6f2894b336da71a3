using System.Collections.Immutable;

namespace StratLink.AgeModelling.Calibration;

/// <summary>
/// A calendar-age probability distribution on a 1-yr grid (cal BP): <see cref="Probabilities"/>[k] is the
/// probability of year <see cref="StartBP"/> + k, summing to 1. Each year's probability is taken as spread
/// evenly over [year - 0.5, year + 0.5], which makes the CDF continuous for the median and for draws.
/// </summary>
public sealed class CalibratedDensity
{
    /// <summary>The usual 1 and 2 sigma levels of a normal distribution.</summary>
    public const double OneSigmaLevel = 0.6827, TwoSigmaLevel = 0.9545;

    private readonly double[] _p;
    private readonly double[] _cdf;

    /// <summary>Builds from non-negative weights, normalised here to sum 1.</summary>
    public CalibratedDensity(int startBP, double[] weights)
    {
        double sum = 0;
        foreach (double w in weights)
        {
            if (!(w >= 0) || double.IsInfinity(w)) throw new ArgumentException("Weights must be finite and non-negative.", nameof(weights));
            sum += w;
        }
        if (!(sum > 0)) throw new ArgumentException("A density needs some positive weight.", nameof(weights));
        StartBP = startBP;
        _p = new double[weights.Length];
        _cdf = new double[weights.Length];
        double acc = 0;
        for (int k = 0; k < _p.Length; k++)
        {
            _p[k] = weights[k] / sum;
            acc += _p[k];
            _cdf[k] = acc;
        }
        _cdf[^1] = 1.0;
    }

    public int StartBP { get; }
    public int EndBP => StartBP + _p.Length - 1;
    public IReadOnlyList<double> Probabilities => _p;
    public int Count => _p.Length;

    public double Median => InverseCdf(0.5);

    public double Mean
    {
        get
        {
            double m = 0;
            for (int k = 0; k < _p.Length; k++) m += _p[k] * (StartBP + k);
            return m;
        }
    }

    /// <summary>Standard deviation, years (a weight for ordering fallbacks, not a summary to report).</summary>
    public double StandardDeviation
    {
        get
        {
            double m = Mean, v = 0;
            for (int k = 0; k < _p.Length; k++) v += _p[k] * (StartBP + k - m) * (StartBP + k - m);
            return Math.Sqrt(v + 1.0 / 12); // + the spread within each year
        }
    }

    /// <summary>Calendar age (cal BP) at cumulative probability <paramref name="u"/> in [0, 1]: draws use this, so they follow the full distribution.</summary>
    public double InverseCdf(double u)
    {
        if (!(u >= 0 && u <= 1)) throw new ArgumentOutOfRangeException(nameof(u), u, "A probability is between 0 and 1.");
        int k = Array.BinarySearch(_cdf, u);
        if (k < 0) k = ~k;
        // Skip empty years so the result lies where there is probability.
        while (k < _p.Length - 1 && _p[k] == 0) k++;
        double below = k == 0 ? 0 : _cdf[k - 1];
        double within = _p[k] > 0 ? Math.Clamp((u - below) / _p[k], 0, 1) : 0.5;
        return StartBP + k - 0.5 + within;
    }

    /// <summary>
    /// Highest-posterior-density set at <paramref name="level"/> (e.g. 0.9545): years taken in order of
    /// falling probability until their sum reaches the level (ties go to the younger year), reported as
    /// contiguous runs, youngest first, each with its own probability.
    /// </summary>
    public ImmutableArray<HpdRange> Hpd(double level)
    {
        if (!(level > 0 && level <= 1)) throw new ArgumentOutOfRangeException(nameof(level), level, "A level is in (0, 1].");
        var order = new int[_p.Length];
        for (int k = 0; k < order.Length; k++) order[k] = k;
        Array.Sort(order, (a, b) => _p[a] != _p[b] ? _p[b].CompareTo(_p[a]) : a.CompareTo(b));
        var keep = new bool[_p.Length];
        double acc = 0;
        foreach (int k in order)
        {
            if (acc >= level || _p[k] == 0) break;
            keep[k] = true;
            acc += _p[k];
        }
        var ranges = ImmutableArray.CreateBuilder<HpdRange>();
        for (int k = 0; k < keep.Length; k++)
        {
            if (!keep[k]) continue;
            int start = k;
            double mass = 0;
            while (k < keep.Length && keep[k]) mass += _p[k++];
            ranges.Add(new HpdRange(StartBP + start, StartBP + k - 1, mass));
        }
        return ranges.ToImmutable();
    }

    /// <summary>
    /// <see cref="Hpd"/> with each range rounded outward to multiples of <paramref name="stepYears"/> (5 or 10 yr
    /// is the usual practice) and ranges that then touch or overlap merged, their probabilities added.
    /// </summary>
    public ImmutableArray<HpdRange> HpdRoundedOutward(double level, int stepYears)
    {
        if (stepYears < 1) throw new ArgumentOutOfRangeException(nameof(stepYears), stepYears, "A rounding step is at least one year.");
        var merged = ImmutableArray.CreateBuilder<HpdRange>();
        foreach (var r in Hpd(level))
        {
            int young = (int)Math.Floor(r.YoungBP / (double)stepYears) * stepYears;
            int old = (int)Math.Ceiling(r.OldBP / (double)stepYears) * stepYears;
            if (merged.Count > 0 && young <= merged[^1].OldBP)
                merged[^1] = merged[^1] with { OldBP = Math.Max(old, merged[^1].OldBP), Probability = merged[^1].Probability + r.Probability };
            else
                merged.Add(new HpdRange(young, old, r.Probability));
        }
        return merged.ToImmutable();
    }
}
