namespace StratLink.Alignment;

/// <summary>What a step pattern's accumulated cost is divided by to compare paths of different length.</summary>
public enum StepNormalisation
{
    /// <summary>Not normalisable (e.g. symmetric1): open ends are refused.</summary>
    None,

    /// <summary>Query length N (asymmetric, Rabiner-Juang "c" types).</summary>
    N,

    /// <summary>N + M (symmetric2, Sakoe-Chiba symmetric P = 1).</summary>
    NPlusM,
}
