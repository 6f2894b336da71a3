using StratLink.Alignment;

namespace StratLink.Tests.Alignment;

/// <summary>
/// The measured error of a straight continuation against processes whose answer is known: a
/// mapping departing from its long-run line by a stationary first-order autoregressive offset
/// (coefficient phi per sample, variance s^2) departs after k samples by a mean square of
/// 2 s^2 (1 - phi^k), twice the semivariogram of an AR(1) process whose autocorrelation is phi^k
/// (Box and Jenkins, Time Series Analysis, from memory); by a random-walk offset (step sd sigma),
/// by sigma^2 k, the variance of a sum of k independent steps. Composite distance is k samples times
/// the spacing times the long-run ratio.
/// </summary>
public class ExtrapolationErrorTests
{
    private const int Samples = 20000;
    private const double Spacing = 0.5;

    private static double Normal(Random rng) => Math.Sqrt(-2 * Math.Log(1 - rng.NextDouble())) * Math.Cos(2 * Math.PI * rng.NextDouble());

    private static (double[] X, double[] Y) Record(double ratio, double[] offset) =>
        ([.. Enumerable.Range(0, offset.Length).Select(i => 100 + i * Spacing)], [.. offset.Select((u, i) => 40 + ratio * (100 + i * Spacing) + u)]);

    private static double[] Ar1(int seed, double phi, double sd)
    {
        var rng = new Random(seed);
        var u = new double[Samples];
        u[0] = sd * Normal(rng);
        for (int i = 1; i < u.Length; i++) u[i] = phi * u[i - 1] + sd * Math.Sqrt(1 - phi * phi) * Normal(rng);
        return u;
    }

    [Fact]
    public void A_mapping_on_its_long_run_line_has_no_extrapolation_error()
    {
        var error = ExtrapolationError.Measure([Record(0.8, new double[200])], 0.5)!;
        // Tolerance: rounding only.
        Assert.Equal(0, error.At(10), 1e-9);
        Assert.Equal(0, error.At(1000), 1e-9);
        Assert.Equal(39.5, error.Reach, 1e-9); // half the record, 99 samples of 0.4 cm (39.6 cm), on the 0.5 cm grid
    }

    [Theory]
    [InlineData(1)]
    [InlineData(5)]
    [InlineData(20)]
    [InlineData(60)]
    public void An_autoregressive_offset_departs_by_its_variogram(int lag)
    {
        const double phi = 0.9, sd = 2, ratio = 0.8;
        var error = ExtrapolationError.Measure([Record(ratio, Ar1(3, phi, sd))], 0.1)!;
        double expected = Math.Sqrt(2 * sd * sd * (1 - Math.Pow(phi, lag)));
        // About 20000 / 19 = 1000 independent values (correlation length (1 + phi) / (1 - phi) samples):
        // the mean square's relative standard error about sqrt(2 / 1000) = 4.5 %, its root's half
        // that; 7 % is three of those, fixed seed.
        Assert.Equal(expected, error.At(lag * Spacing * ratio), 0.07 * expected);
    }

    [Theory]
    [InlineData(4)]
    [InlineData(16)]
    [InlineData(50)]
    public void A_random_walk_offset_departs_by_the_square_root_of_its_steps(int lag)
    {
        const double sigma = 0.3, ratio = 1.25;
        var rng = new Random(5);
        var u = new double[Samples];
        for (int i = 1; i < u.Length; i++) u[i] = u[i - 1] + sigma * Normal(rng);
        var error = ExtrapolationError.Measure([Record(ratio, u)], 0.125)!;
        double expected = sigma * Math.Sqrt(lag);
        // Overlapping increments: about 20000 / lag independent ones, at most 400 here, so the mean
        // square's relative standard error is at most sqrt(2 / 400) = 7 %, its root's 3.5 %; 10 % is
        // about three of those (the line fitted to the walk takes a share of order lag / 20000 more), fixed seed.
        Assert.Equal(expected, error.At(lag * Spacing * ratio), 0.10 * expected);
    }

    [Fact]
    public void Records_of_different_ratios_are_pooled_at_the_same_composite_distance()
    {
        // The same AR(1) process in two records at ratios 0.8 and 1.6: at a composite distance of
        // 8 cm the first has moved 20 samples, the second 10; pooled with equal pairs, the mean of
        // the two mean squares.
        const double phi = 0.9, sd = 2;
        var error = ExtrapolationError.Measure([Record(0.8, Ar1(7, phi, sd)), Record(1.6, Ar1(8, phi, sd))], 0.1)!;
        double pairs20 = Samples - 20, pairs10 = Samples - 10;
        double expected = Math.Sqrt((pairs20 * 2 * sd * sd * (1 - Math.Pow(phi, 20)) + pairs10 * 2 * sd * sd * (1 - Math.Pow(phi, 10))) / (pairs20 + pairs10));
        // Two records of about 1000 independent values each: 7 % as above is more than three standard errors.
        Assert.Equal(expected, error.At(8), 0.07 * expected);
    }
}
