namespace StratLink.Compositing;

/// <summary>
/// The splice: a continuous section along composite depth made of intervals of the best core at
/// each depth, joined at tie points (the CCSF-D convention of scientific ocean drilling).
/// </summary>
public sealed class Splice
{
    private readonly string?[] _sourceByRow;

    public Splice(bool automatic, IReadOnlyList<SplicePiece> pieces, string?[] sourceByRow)
    {
        Automatic = automatic;
        Pieces = pieces;
        _sourceByRow = sourceByRow;
    }

    /// <summary>True when chosen by the program, false when the project file lists the intervals.</summary>
    public bool Automatic { get; }

    /// <summary>The intervals, ascending in composite depth.</summary>
    public IReadOnlyList<SplicePiece> Pieces { get; }

    /// <summary>Core the splice takes at each composite grid row; null where no interval covers the row.</summary>
    public IReadOnlyList<string?> SourceByRow => _sourceByRow;
}
