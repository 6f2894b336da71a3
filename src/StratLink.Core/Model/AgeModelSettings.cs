namespace StratLink.Model;

/// <summary>Monte Carlo age-depth modelling settings.</summary>
public sealed record AgeModelSettings
{
    public int Iterations { get; init; } = 2000;

    /// <summary>Seed of every random draw in a build; recorded in run.json.</summary>
    public int Seed { get; init; } = 42;

    /// <summary><c>linear</c> (default) or <c>monotone-spline</c>.</summary>
    public string Interpolation { get; init; } = "linear";
}
