namespace StratLink.Workflows;

/// <summary>Progress of a long run, reported through <see cref="IProgress{T}"/>: the stage and its fraction done (0..1).</summary>
public readonly record struct WorkProgress(string Stage, double Fraction, string? Detail = null);
