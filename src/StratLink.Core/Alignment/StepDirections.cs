using System.Buffers;
using System.Runtime.CompilerServices;

namespace StratLink.Alignment;

/// <summary>
/// The production taken into each band cell of a DTW lattice (0-based, in the pattern's order), two
/// bits a cell: a 10,000 x 10,000 lattice needs 25 MB. Each row starts on a byte of its own, so
/// rows can be written concurrently and a row's last byte never holds another row's cells. The
/// start cell and unreachable cells hold no production; the solvers know them by position and by
/// their infinite cost. Memory is rented from the shared pool and returned by <see cref="Dispose"/>:
/// repeated alignments (segments, ensemble members, the checks' realignments) reuse pages already
/// mapped instead of faulting in fresh ones.
/// </summary>
public sealed class StepDirections : IDisposable
{
    /// <summary>Patterns with at most this many productions fit in two bits a cell.</summary>
    public const int MaxProductions = 4;

    private readonly long[] _rowByte;
    private readonly int[] _lo;
    private byte[]? _bytes;

    /// <summary>Rents a table for <paramref name="band"/>; cells are unset until written.</summary>
    public StepDirections(Band band)
    {
        int n = band.Rows;
        _rowByte = new long[n + 1];
        _lo = band.Lo.ToArray();
        var hi = band.Hi;
        for (int i = 0; i < n; i++) _rowByte[i + 1] = _rowByte[i] + ((Math.Max(0, hi[i] - _lo[i] + 1) + 3) >> 2);
        if (_rowByte[n] > Array.MaxLength)
            throw new ArgumentException($"The band holds {band.Cells} cells, more than one alignment can store; narrow the window or coarsen the grid step.");
        _bytes = ArrayPool<byte>.Shared.Rent((int)Math.Max(1, _rowByte[n]));
    }

    /// <summary>Bytes the table occupies.</summary>
    public long ByteCount => _rowByte[^1];

    internal byte[] Bytes => _bytes ?? throw new ObjectDisposedException(nameof(StepDirections));

    /// <summary>Index of the byte holding the first cell of row i (its cell at column Lo[i], bits 0-1).</summary>
    internal long RowByte(int i) => _rowByte[i];

    /// <summary>The production (0-based) taken into cell (i, j), which must lie in the band.</summary>
    public int this[int i, int j]
    {
        [MethodImpl(MethodImplOptions.AggressiveInlining)]
        get
        {
            int q = j - _lo[i];
            return (Bytes[_rowByte[i] + (q >> 2)] >> ((q & 3) << 1)) & 3;
        }
    }

    /// <summary>Records production <paramref name="production"/> (0-based) for cell (i, j) of the band.</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public void Set(int i, int j, int production) => Set(Bytes, _rowByte[i], j - _lo[i], production);

    /// <summary>Writes cell <paramref name="q"/> (0-based within its row) of the row starting at byte <paramref name="rowByte"/>.</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    internal static void Set(byte[] bytes, long rowByte, int q, int production)
    {
        ref byte b = ref bytes[rowByte + (q >> 2)];
        int shift = (q & 3) << 1;
        b = (byte)((b & ~(3 << shift)) | (production << shift));
    }

    public void Dispose()
    {
        if (_bytes is { } bytes) ArrayPool<byte>.Shared.Return(bytes);
        _bytes = null;
    }
}
