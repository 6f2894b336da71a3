namespace StratLink.Demo;

/// <summary>
/// Shape of a generated site beyond the shipped demo: which core is the reference and recovered
/// lengths chosen per core, so that tests can build sites where a core runs past the reference's
/// base or the reference is the shortest core. <see cref="Shipped"/> is the demo as written by
/// <c>stratlink demo</c>.
/// </summary>
public sealed record DemoSiteShape
{
    public static readonly DemoSiteShape Shipped = new();

    /// <summary>Core the project aligns to and whose depths are the true composite depths.</summary>
    public string Reference { get; init; } = DemoSiteGenerator.ReferenceCore;

    /// <summary>
    /// Recovered length (cm) of a core, replacing the drawn one; such a core is not cut to end above
    /// the reference's base, so it may run past it.
    /// </summary>
    public IReadOnlyDictionary<string, double> Lengths { get; init; } = new Dictionary<string, double>();

    /// <summary>Length of a core when chosen, else null (drawn as in the demo).</summary>
    internal double? LengthOf(string coreId) => Lengths.TryGetValue(coreId, out double l) ? l : null;
}
