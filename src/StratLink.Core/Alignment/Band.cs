namespace StratLink.Alignment;

/// <summary>
/// The cells of an n x m lattice a path may visit: for each row i (query) a column range
/// [Lo[i], Hi[i]] (0-based, inclusive). Banded storage of one value per allowed cell is laid out
/// row after row from <see cref="Offset"/>, so memory grows with the band, not with n x m.
/// </summary>
public sealed class Band
{
    private readonly int[] _lo;
    private readonly int[] _hi;
    private readonly long[] _offset;

    public Band(int columns, int[] lo, int[] hi)
    {
        if (lo.Length != hi.Length) throw new ArgumentException("Band bounds differ in length.");
        Rows = lo.Length;
        Columns = columns;
        _lo = lo;
        _hi = hi;
        _offset = new long[Rows + 1];
        for (int i = 0; i < Rows; i++)
        {
            if (lo[i] < 0 || hi[i] >= columns) throw new ArgumentException($"Band row {i} [{lo[i]}, {hi[i]}] lies outside 0..{columns - 1}.");
            _offset[i + 1] = _offset[i] + Math.Max(0, hi[i] - lo[i] + 1);
        }
    }

    public int Rows { get; }
    public int Columns { get; }
    public ReadOnlySpan<int> Lo => _lo;
    public ReadOnlySpan<int> Hi => _hi;

    /// <summary>Index of the first cell of row i in banded storage.</summary>
    public long Offset(int i) => _offset[i];

    /// <summary>Number of allowed cells.</summary>
    public long Cells => _offset[Rows];

    public bool Contains(int i, int j) => (uint)i < (uint)Rows && j >= _lo[i] && j <= _hi[i];

    /// <summary>Storage index of cell (i, j), which must lie in the band.</summary>
    public long Index(int i, int j) => _offset[i] + (j - _lo[i]);

    public static Band Full(int rows, int columns)
    {
        var lo = new int[rows];
        var hi = new int[rows];
        Array.Fill(hi, columns - 1);
        return new Band(columns, lo, hi);
    }

    /// <summary>The Sakoe-Chiba window as the R package dtw lays it: |j - i| &lt;= width (no slope correction).</summary>
    public static Band SakoeChiba(int rows, int columns, int width)
    {
        var lo = new int[rows];
        var hi = new int[rows];
        for (int i = 0; i < rows; i++)
        {
            lo[i] = Math.Max(0, i - width);
            hi[i] = Math.Min(columns - 1, i + width);
            if (lo[i] > hi[i]) { lo[i] = Math.Min(lo[i], columns - 1); hi[i] = lo[i] - 1; }
        }
        return new Band(columns, lo, hi);
    }

    /// <summary>The rows i0..i1 and columns j0..j1 of this band as a band of its own (a segment's lattice).</summary>
    public Band Slice(int i0, int i1, int j0, int j1)
    {
        int rows = i1 - i0 + 1;
        var lo = new int[rows];
        var hi = new int[rows];
        for (int r = 0; r < rows; r++)
        {
            lo[r] = Math.Max(_lo[i0 + r], j0) - j0;
            hi[r] = Math.Min(_hi[i0 + r], j1) - j0;
            if (lo[r] > hi[r]) { lo[r] = Math.Min(lo[r], j1 - j0); hi[r] = lo[r] - 1; }
        }
        return new Band(j1 - j0 + 1, lo, hi);
    }
}
