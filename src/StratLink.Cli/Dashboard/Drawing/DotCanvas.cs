using System.Text;

namespace StratLink.Cli.Dashboard.Drawing;

/// <summary>
/// A grid of terminal cells, each holding 2 x 4 dots (the braille cell), so curves are drawn at
/// twice the column and four times the row resolution. Dot (x, y) has x across, y down.
/// </summary>
public sealed class DotCanvas
{
    // Braille dot bits by [column within cell, row within cell] (Unicode block U+2800).
    private static readonly int[,] Bit = { { 0x01, 0x02, 0x04, 0x40 }, { 0x08, 0x10, 0x20, 0x80 } };

    private readonly byte[] _bits;

    public DotCanvas(int columns, int rows)
    {
        Columns = Math.Max(0, columns);
        Rows = Math.Max(0, rows);
        _bits = new byte[Columns * Rows];
    }

    public int Columns { get; }
    public int Rows { get; }
    public int DotWidth => Columns * 2;
    public int DotHeight => Rows * 4;

    public void Set(int x, int y)
    {
        if (x < 0 || y < 0 || x >= DotWidth || y >= DotHeight) return;
        _bits[(y >> 2) * Columns + (x >> 1)] |= (byte)Bit[x & 1, y & 3];
    }

    /// <summary>Dots along a straight line (Bresenham), ends included; with <paramref name="every"/> &gt; 1 only every n-th dot (a dotted line).</summary>
    public void Line(int x0, int y0, int x1, int y1, int every = 1)
    {
        int dx = Math.Abs(x1 - x0), dy = -Math.Abs(y1 - y0);
        int sx = x0 < x1 ? 1 : -1, sy = y0 < y1 ? 1 : -1;
        int err = dx + dy;
        // Bounded by the line length, so a far-off end point cannot loop for long.
        for (int guard = dx - dy + 1, step = 0; guard >= 0; guard--, step++)
        {
            if (step % every == 0) Set(x0, y0);
            if (x0 == x1 && y0 == y1) return;
            int e2 = 2 * err;
            if (e2 >= dy) { err += dy; x0 += sx; }
            if (e2 <= dx) { err += dx; y0 += sy; }
        }
    }

    /// <summary>A horizontal run of dots from x0 to x1 on dot row y.</summary>
    public void Run(int x0, int x1, int y)
    {
        if (x1 < x0) (x0, x1) = (x1, x0);
        x0 = Math.Max(0, x0);
        x1 = Math.Min(DotWidth - 1, x1);
        for (int x = x0; x <= x1; x++) Set(x, y);
    }

    public bool IsInked(int column, int row) => _bits[row * Columns + column] != 0;

    /// <summary>The cell's glyph: a braille pattern, or <paramref name="asciiInk"/> when braille is not available.</summary>
    public Rune CellRune(int column, int row, bool unicode, char asciiInk)
    {
        byte b = _bits[row * Columns + column];
        if (b == 0) return new Rune(' ');
        return unicode ? new Rune(0x2800 + b) : new Rune(asciiInk);
    }
}
