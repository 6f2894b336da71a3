using MathNet.Numerics.Distributions;

namespace StratLink.Demo;

/// <summary>
/// The true history of the invented site on an annual calendar-age grid: the climate signal every
/// core records (AR(1) red noise, cycles and regime shifts) and a slower, independent productivity
/// component that only some proxies see.
/// </summary>
public sealed class SiteHistory
{
    private SiteHistory(double topAgeBP, double[] climate, double[] productivity, double ar1Coefficient, double ar1StdDev,
        IReadOnlyList<SignalCycle> cycles, IReadOnlyList<RegimeShift> shifts)
    {
        TopAgeBP = topAgeBP;
        Climate = climate;
        Productivity = productivity;
        Ar1Coefficient = ar1Coefficient;
        Ar1StdDev = ar1StdDev;
        Cycles = cycles;
        RegimeShifts = shifts;
        AgesBP = new double[climate.Length];
        for (int i = 0; i < AgesBP.Length; i++) AgesBP[i] = topAgeBP + i;
    }

    /// <summary>Age of the first value (the coring year).</summary>
    public double TopAgeBP { get; }

    /// <summary>Calendar age of each value, cal BP, one per year, ascending.</summary>
    public double[] AgesBP { get; }

    /// <summary>The true climate signal (dimensionless, red-noise standard deviation 1).</summary>
    public double[] Climate { get; }

    /// <summary>Second site-wide component (dimensionless, slow AR(1)); it moves density and Ca/Ti, not the cycles.</summary>
    public double[] Productivity { get; }

    /// <summary>Lag-one (one year) autocorrelation of the climate signal's red noise.</summary>
    public double Ar1Coefficient { get; }

    /// <summary>Stationary standard deviation of the climate signal's red noise.</summary>
    public double Ar1StdDev { get; }

    public IReadOnlyList<SignalCycle> Cycles { get; }
    public IReadOnlyList<RegimeShift> RegimeShifts { get; }

    public double OldestAgeBP => AgesBP[^1];

    /// <summary>Mean level set by the regime shifts at an age (0 in the oldest regime).</summary>
    public double RegimeMeanAt(double ageBP) => RegimeShifts.Where(s => ageBP < s.AgeBP).Sum(s => s.Step);

    internal double ClimateAt(double ageBP) => Interpolate(Climate, ageBP);
    internal double ProductivityAt(double ageBP) => Interpolate(Productivity, ageBP);

    private double Interpolate(double[] values, double ageBP)
    {
        double x = Math.Clamp(ageBP - TopAgeBP, 0, values.Length - 1);
        int i = Math.Min((int)x, values.Length - 2);
        double f = x - i;
        return values[i] + f * (values[i + 1] - values[i]);
    }

    internal static SiteHistory Simulate(Random rng, double topAgeBP, int years, double ar1Coefficient, double ar1StdDev,
        IReadOnlyList<SignalCycle> cycles, IReadOnlyList<RegimeShift> shifts, double productivityAr1)
    {
        double[] red = Ar1(rng, years, ar1Coefficient, ar1StdDev);
        double[] productivity = Ar1(rng, years, productivityAr1, 1.0);
        var climate = new double[years];
        var history = new SiteHistory(topAgeBP, climate, productivity, ar1Coefficient, ar1StdDev, cycles, shifts);
        for (int i = 0; i < years; i++)
        {
            double age = history.AgesBP[i];
            climate[i] = red[i] + cycles.Sum(c => c.ValueAt(age)) + history.RegimeMeanAt(age);
        }
        return history;
    }

    /// <summary>Stationary AR(1): x_i = phi x_(i-1) + e_i, Var e = sigma^2 (1 - phi^2), started from the stationary law.</summary>
    private static double[] Ar1(Random rng, int n, double phi, double sigma)
    {
        var x = new double[n];
        double innovation = sigma * Math.Sqrt(1 - phi * phi);
        x[0] = Normal.Sample(rng, 0, sigma);
        for (int i = 1; i < n; i++) x[i] = phi * x[i - 1] + Normal.Sample(rng, 0, innovation);
        return x;
    }
}
