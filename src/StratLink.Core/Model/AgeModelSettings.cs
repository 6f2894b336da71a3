namespace StratLink.Model;

/// <summary>Monte Carlo age-depth modelling settings.</summary>
public sealed record AgeModelSettings
{
    public int Iterations { get; init; } = 2000;

    /// <summary>Seed of every random draw in a build; recorded in run.json.</summary>
    public int Seed { get; init; } = 42;

    /// <summary><c>linear</c> (default) or <c>monotone-spline</c>.</summary>
    public string Interpolation { get; init; } = "linear";

    /// <summary>
    /// Standard deviation of the change in log accumulation rate across one interval between age controls (a random
    /// walk, bridged to hit both controls' ages); 0 gives straight lines between controls. Default 1.0 (see
    /// <see cref="DefaultRateVariability"/>).
    /// </summary>
    public double RateVariability { get; init; } = DefaultRateVariability;

    /// <summary>
    /// Depth window (project unit) over which each member's accumulation rate is read, as the secant of its age;
    /// null: <see cref="DefaultRateWindowSteps"/> steps of the alignment grid or the composite, whichever is coarser.
    /// </summary>
    public double? RateWindow { get; init; }

    /// <summary>
    /// A dtw member maps each core row to a whole reference column, so its slope at one depth is 0 or many
    /// times the true ratio; over ten steps the column's rounding moves the rate by about 10 % (our own choice).
    /// </summary>
    public const int DefaultRateWindowSteps = 10;

    /// <summary>
    /// Estimated here from the published orbitally tuned age models of ODP Sites 925 and 927 (Bickert, Curry and
    /// Wefer 1997, Proc. ODP Sci. Results 154:239-254; 373 and 620 tie points): taking every 4th tie point as a
    /// control (2-4 m, about 90-170 kyr apart), the ages of the skipped ties depart from straight lines between the
    /// controls by an RMS 9-10 % of the interval's age span (95th percentile 21 %); the bridged walk with 1.0 gives
    /// 10 % (95th percentile 21 %). Controls every 2nd to 16th tie give 6-16 %, i.e. 0.6-1.5.
    /// </summary>
    public const double DefaultRateVariability = 1.0;
}
