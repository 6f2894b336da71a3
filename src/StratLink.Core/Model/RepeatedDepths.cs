namespace StratLink.Model;

/// <summary>How a core table's rows that share one depth (replicate measurements) become one sample.</summary>
public enum RepeatedDepths
{
    /// <summary>Refuse the table: each depth holds one sample.</summary>
    Error,

    /// <summary>The mean of the replicates' values (missing values left out).</summary>
    Mean,

    /// <summary>The median of the replicates' values (missing values left out).</summary>
    Median,

    /// <summary>The first replicate in file order.</summary>
    First,
}
