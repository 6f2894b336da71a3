namespace StratLink.Alignment;

/// <summary>
/// A dynamic time warping step pattern: productions that reach cell (i, j) from an origin cell,
/// each adding weighted local costs of the cells it passes (Sakoe and Chiba 1978; Rabiner and
/// Juang 1993; notation of Giorgino 2009, J. Stat. Softw. 31(7)). The order of the productions
/// is the tie-break order: the first production with the least cost wins.
/// </summary>
public sealed class StepPattern
{
    private StepPattern(string name, StepNormalisation normalisation, Production[] productions)
    {
        Name = name;
        Normalisation = normalisation;
        Productions = productions;
        foreach (var p in productions)
        {
            MaxBackI = Math.Max(MaxBackI, p.OriginI);
            MaxBackJ = Math.Max(MaxBackJ, p.OriginJ);
        }
    }

    public string Name { get; }
    public StepNormalisation Normalisation { get; }
    public IReadOnlyList<Production> Productions { get; }

    /// <summary>Largest row offset of an origin (how many earlier rows the recursion reads).</summary>
    public int MaxBackI { get; }

    public int MaxBackJ { get; }

    /// <summary>g = d + min(g[i-1,j-1], g[i,j-1], g[i-1,j]); not normalisable ("White-Neely").</summary>
    public static readonly StepPattern Symmetric1 = new("symmetric1", StepNormalisation.None,
    [
        new(1, 1, [new(0, 0, 1)]),
        new(0, 1, [new(0, 0, 1)]),
        new(1, 0, [new(0, 0, 1)]),
    ]);

    /// <summary>Sakoe-Chiba symmetric, P = 0: the diagonal step weighs 2d; normalised by N + M.</summary>
    public static readonly StepPattern Symmetric2 = new("symmetric2", StepNormalisation.NPlusM,
    [
        new(1, 1, [new(0, 0, 2)]),
        new(0, 1, [new(0, 0, 1)]),
        new(1, 0, [new(0, 0, 1)]),
    ]);

    /// <summary>Sakoe-Chiba asymmetric, P = 0: every query row matched once, reference slope 0 to 2; normalised by N.</summary>
    public static readonly StepPattern Asymmetric = new("asymmetric", StepNormalisation.N,
    [
        new(1, 0, [new(0, 0, 1)]),
        new(1, 1, [new(0, 0, 1)]),
        new(1, 2, [new(0, 0, 1)]),
    ]);

    /// <summary>
    /// Sakoe-Chiba symmetric, P = 1: after one step off the diagonal at least one diagonal step,
    /// so the local slope stays between 1/2 and 2 (Sakoe and Chiba 1978, table I).
    /// </summary>
    public static readonly StepPattern SymmetricP1 = new("symmetricP1", StepNormalisation.NPlusM,
    [
        new(1, 2, [new(0, 1, 2), new(0, 0, 1)]),
        new(1, 1, [new(0, 0, 2)]),
        new(2, 1, [new(1, 0, 2), new(0, 0, 1)]),
    ]);

    /// <summary>Rabiner and Juang (1993) type IV, slope weighting "c" (weight = query step); normalised by N.</summary>
    public static readonly StepPattern RabinerJuang4c = new("rabinerJuang4c", StepNormalisation.N,
    [
        new(2, 1, [new(1, 0, 1), new(0, 0, 1)]),
        new(2, 2, [new(1, 0, 1), new(0, 0, 1)]),
        new(1, 1, [new(0, 0, 1)]),
        new(1, 2, [new(0, 0, 1)]),
    ]);

    /// <summary>Myers, Rabiner and Rosenberg (1980) type III, weighting "c"; normalised by N.</summary>
    public static readonly StepPattern TypeIIIc = new("typeIIIc", StepNormalisation.N,
    [
        new(1, 2, [new(0, 0, 1)]),
        new(1, 1, [new(0, 0, 1)]),
        new(2, 1, [new(1, 0, 1), new(0, 0, 1)]),
        new(2, 2, [new(1, 0, 1), new(0, 0, 1)]),
    ]);

    /// <summary>Names accepted in project files and on the command line.</summary>
    public static readonly IReadOnlyList<StepPattern> All = [Symmetric1, Symmetric2, Asymmetric, SymmetricP1, RabinerJuang4c, TypeIIIc];

    public static IReadOnlyList<string> Names => All.Select(p => p.Name).ToArray();

    public static StepPattern? Find(string name) =>
        All.FirstOrDefault(p => string.Equals(p.Name, name, StringComparison.OrdinalIgnoreCase));

    public static StepPattern Parse(string name) =>
        Find(name) ?? throw new ArgumentException($"unknown step pattern '{name}' ({string.Join(", ", Names)})", nameof(name));

    /// <summary>The normaliser of a path ending at 0-based (n-1, jEnd) of a query of length n, or NaN when not normalisable.</summary>
    public double Normaliser(int n, int jEnd) => Normalisation switch
    {
        StepNormalisation.N => n,
        StepNormalisation.NPlusM => n + jEnd + 1,
        _ => double.NaN,
    };

    public override string ToString() => Name;
}
