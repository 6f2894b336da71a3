namespace StratLink.Export;

/// <summary>The tables the compositing stage writes.</summary>
public enum CompositeTableKind
{
    /// <summary><c>composite.csv</c>: grid, ages, splice core and stacked signals.</summary>
    Composite,

    /// <summary><c>splice.csv</c>: the splice intervals.</summary>
    Splice,

    /// <summary>All cores' mappings in one table with a leading <c>core</c> column (<c>mapping-&lt;core&gt;.csv</c> hold one core each).</summary>
    Mappings,
}
