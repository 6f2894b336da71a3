using StratLink.Alignment;

namespace StratLink.Tests.Alignment;

/// <summary>The two-bit table of DTW step directions: its size and that no cell overwrites another.</summary>
public class StepDirectionsTests
{
    [Fact]
    public void A_ten_thousand_square_lattice_takes_a_quarter_byte_a_cell()
    {
        // 10^8 cells at 2 bits = 25,000,000 bytes (arithmetic); rows of 10,000 cells fill whole bytes.
        using var table = new StepDirections(Band.Full(10_000, 10_000));
        Assert.Equal(25_000_000, table.ByteCount);
    }

    [Fact]
    public void Every_cell_reads_back_what_was_last_written_to_it()
    {
        var rng = new Random(7);
        int n = 300, m = 257;
        var lo = new int[n];
        var hi = new int[n];
        for (int i = 0; i < n; i++)
        {
            lo[i] = rng.Next(0, m);
            hi[i] = Math.Min(m - 1, lo[i] + rng.Next(-1, 12)); // some rows empty, some one cell
        }
        var band = new Band(m, lo, hi);
        using var table = new StepDirections(band);
        var expected = new Dictionary<(int, int), int>();
        // Random order across rows, each cell written twice: neighbours in a byte and rows next to each other must not clobber.
        var cells = Enumerable.Range(0, n).SelectMany(i => Enumerable.Range(lo[i], Math.Max(0, hi[i] - lo[i] + 1)).Select(j => (i, j))).ToList();
        for (int pass = 0; pass < 2; pass++)
            foreach (var (i, j) in cells.OrderBy(_ => rng.Next()))
            {
                int p = rng.Next(0, StepDirections.MaxProductions);
                table.Set(i, j, p);
                expected[(i, j)] = p;
            }
        foreach (var ((i, j), p) in expected) Assert.Equal(p, table[i, j]);
        Assert.True(table.ByteCount <= band.Cells / 4 + n, $"{table.ByteCount} bytes for {band.Cells} cells in {n} rows");
    }
}
