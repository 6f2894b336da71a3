using System.Buffers;
using System.Runtime.CompilerServices;
using System.Runtime.Intrinsics;
using System.Runtime.Intrinsics.X86;

namespace StratLink.Alignment;

/// <summary>
/// Optimal dynamic time warping over a banded lattice. Memory: one byte per band cell for the
/// backtracking direction (the 1-based production taken, 0 = start) and a few rolling rows of
/// accumulated cost; no n x m matrix of doubles.
/// Conventions follow the R package dtw 1.23 (Giorgino 2009): the start cell is seeded with d(1,1)
/// for every pattern, ties go to the first production in the pattern's order, the window is checked
/// at origins and arrivals, open begin adds a virtual row of zero cost before the query, and open
/// end picks the first arg-min of the normalised last row while reporting the unnormalised cost.
/// </summary>
public static class DtwSolver
{
    internal const double QuarterTurn = Math.PI / 4;

    /// <summary>Refuses option and pattern combinations that have no meaning, with the reason.</summary>
    public static void Validate(StepPattern pattern, DtwOptions options)
    {
        if (options.CompletionCostPerColumn is not null) return;
        if (options.OpenEnd && pattern.Normalisation == StepNormalisation.None)
            throw new ArgumentException($"Open-end alignments need a normalisable step pattern; {pattern.Name} is not normalisable (use symmetric2, asymmetric, symmetricP1, ...).");
        if (options.OpenBegin && pattern.Normalisation != StepNormalisation.N)
            throw new ArgumentException($"Open-begin alignments need a step pattern normalised by the query length N (asymmetric, rabinerJuang4c, typeIIIc); {pattern.Name} is not.");
    }

    /// <summary>
    /// The optimal path. The table of directions is only needed until the path is traced, so it is
    /// rented from the shared array pool: repeated alignments reuse memory that is already mapped
    /// (first touches of fresh pages cost more than filling the table on some systems).
    /// </summary>
    public static DtwPath Solve<TCost>(TCost cost, StepPattern pattern, Band band, DtwOptions options, CancellationToken ct = default)
        where TCost : struct, ILocalCost
    {
        CheckLattice(pattern, band, options);
        var dirs = ArrayPool<byte>.Shared.Rent((int)band.Cells);
        try
        {
            return FillAndTrace(cost, pattern, band, options, dirs, ct);
        }
        finally
        {
            ArrayPool<byte>.Shared.Return(dirs);
        }
    }

    /// <summary>The optimal path and the banded table of directions taken (1-based production, 0 = start or unreachable).</summary>
    internal static (DtwPath Path, byte[] Directions) SolveKeepingDirections<TCost>(TCost cost, StepPattern pattern, Band band, DtwOptions options, CancellationToken ct)
        where TCost : struct, ILocalCost
    {
        CheckLattice(pattern, band, options);
        // Every cell is written before it is read: no need to zero the table.
        var dirs = GC.AllocateUninitializedArray<byte>((int)band.Cells);
        return (FillAndTrace(cost, pattern, band, options, dirs, ct), dirs);
    }

    private static void CheckLattice(StepPattern pattern, Band band, DtwOptions options)
    {
        Validate(pattern, options);
        if (band.Rows == 0 || band.Columns == 0) throw new ArgumentException("Both series need at least one element.");
        if (band.Cells > Array.MaxLength) throw new ArgumentException($"The band holds {band.Cells} cells, more than one alignment can store; narrow the window or coarsen the grid step.");
    }

    /// <summary>Fills <paramref name="dirs"/> (at least band.Cells long; every band cell is written before it is read) and traces the path back.</summary>
    private static DtwPath FillAndTrace<TCost>(TCost cost, StepPattern pattern, Band band, DtwOptions options, byte[] dirs, CancellationToken ct)
        where TCost : struct, ILocalCost
    {
        double[] lastRow = ReferenceEquals(pattern, StepPattern.Symmetric1) && !options.OpenBegin && options.RatePenalty == 0
            ? FillSymmetric1(cost, band, dirs, ct)
            : Fill(cost, pattern, band, options, dirs, ct);
        return Backtrack(lastRow, dirs, pattern, band, options);
    }

    private static double[] Fill<TCost>(TCost cost, StepPattern pattern, Band band, DtwOptions options, byte[] dirs, CancellationToken ct)
        where TCost : struct, ILocalCost
    {
        int n = band.Rows, m = band.Columns;
        int k = pattern.MaxBackI + 1;
        var ring = new double[k][];
        var ringLo = new int[k];
        var ringHi = new int[k];
        for (int s = 0; s < k; s++)
        {
            ring[s] = new double[m];
            Array.Fill(ring[s], double.PositiveInfinity);
            ringHi[s] = -1;
        }
        var prods = new Production[pattern.Productions.Count];
        for (int p = 0; p < prods.Length; p++) prods[p] = pattern.Productions[p];
        bool openBegin = options.OpenBegin, strict = options.StrictBand;
        double completion = options.CompletionCostPerColumn ?? 0;
        double penalty = options.RatePenalty;
        var lo = band.Lo;
        var hi = band.Hi;

        for (int i = 0; i < n; i++)
        {
            if ((i & 255) == 0) ct.ThrowIfCancellationRequested();
            int slot = i % k;
            var row = ring[slot];
            if (ringHi[slot] >= ringLo[slot]) Array.Fill(row, double.PositiveInfinity, ringLo[slot], ringHi[slot] - ringLo[slot] + 1);
            long off = band.Offset(i) - lo[i];
            for (int j = lo[i]; j <= hi[i]; j++)
            {
                double d0 = cost.Cost(i, j);
                if (i == 0 && j == 0 && !openBegin)
                {
                    row[0] = d0;
                    dirs[off] = 0;
                    continue;
                }
                double best = double.PositiveInfinity;
                byte bp = 0;
                for (int p = 0; p < prods.Length; p++)
                {
                    var prod = prods[p];
                    int oi = i - prod.OriginI, oj = j - prod.OriginJ;
                    if (oj < 0) continue;
                    double c;
                    if (oi >= 0)
                    {
                        c = ring[oi % k][oj];
                        if (double.IsPositiveInfinity(c)) continue;
                    }
                    else if (oi == -1 && openBegin) c = completion * oj;
                    else continue;
                    var cells = prod.CellArray;
                    for (int s = 0; s < cells.Length; s++)
                    {
                        var st = cells[s];
                        if (st.BackI == 0 && st.BackJ == 0) { c += st.Weight * d0; continue; }
                        int ci = i - st.BackI, cj = j - st.BackJ;
                        if (ci < 0) continue; // the virtual row of an open begin costs nothing
                        if (strict && !band.Contains(ci, cj)) { c = double.PositiveInfinity; break; }
                        c += st.Weight * cost.Cost(ci, cj);
                    }
                    if (penalty > 0 && oi >= 0 && band.Contains(oi, oj))
                    {
                        byte od = dirs[band.Index(oi, oj)];
                        if (od != 0) c += penalty * Math.Abs(prod.Angle - prods[od - 1].Angle) / QuarterTurn;
                    }
                    if (c < best) { best = c; bp = (byte)(p + 1); }
                }
                row[j] = best;
                dirs[off + j] = bp;
            }
            ringLo[slot] = lo[i];
            ringHi[slot] = hi[i];
        }
        return ring[(n - 1) % k];
    }

    /// <summary>Rows processed together by <see cref="FillSymmetric1"/>: enough independent chains to keep the FPU busy.</summary>
    private const int StripRows = 4;

    /// <summary>
    /// symmetric1 (g = d + min of the three neighbours), the hot path of plain DTW. Along one row every
    /// cell waits for its left neighbour, so with AVX2 rows are processed four at a time, skewed by one
    /// column per row (row r of a strip works on column t - r at step t) as the four lanes of a vector:
    /// four dependency chains advance per instruction, the inner rows stay in registers, and only the
    /// strip's last row goes to memory. Minima and directions are computed without branches (random
    /// data would mispredict them half the time). Without AVX2, and for rows left over, one row at a time.
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static double[] FillSymmetric1<TCost>(TCost cost, Band band, byte[] dirs, CancellationToken ct)
        where TCost : struct, ILocalCost
    {
        int n = band.Rows, m = band.Columns;
        // Rows are shifted by one: index 0 is a sentinel +inf column left of column 0.
        var prev = new double[m + 1];
        var cur = new double[m + 1];
        Array.Fill(prev, double.PositiveInfinity);
        Array.Fill(cur, double.PositiveInfinity);
        var lo = band.Lo;
        var hi = band.Hi;
        // The range of valid values each array holds; stale ones are cleared before reuse.
        int curLo = 0, curHi = -1, prevLo = 0, prevHi = -1;
        // Local costs of the strip's rows, row r at r * m, indexed by column.
        var costs = new double[StripRows * m];
        Span<long> dirAt = stackalloc long[StripRows];
        for (int i = 0; i < n;)
        {
            ct.ThrowIfCancellationRequested();
            if (curHi >= curLo) Array.Fill(cur, double.PositiveInfinity, curLo + 1, curHi - curLo + 1);
            bool strip = Avx2.IsSupported && i > 0 && i + StripRows <= n;
            for (int r = 0; strip && r < StripRows; r++) strip = hi[i + r] >= lo[i + r];
            if (!strip)
            {
                int l = lo[i], h = hi[i];
                if (h >= l)
                {
                    var d = costs.AsSpan(l, h - l + 1);
                    cost.Row(i, l, d);
                    SingleRow(prev.AsSpan(l, h - l + 2), cur.AsSpan(l, h - l + 2), d, dirs.AsSpan((int)band.Offset(i), h - l + 1), i == 0 && l == 0);
                }
                (prev, cur) = (cur, prev);
                (curLo, curHi, prevLo, prevHi) = (prevLo, prevHi, l, h);
                i++;
                continue;
            }

            int l0 = lo[i], h0 = hi[i], l1 = lo[i + 1], h1 = hi[i + 1], l2 = lo[i + 2], h2 = hi[i + 2], l3 = lo[i + 3], h3 = hi[i + 3];
            for (int r = 0; r < StripRows; r++)
            {
                int l = lo[i + r], h = hi[i + r];
                cost.Row(i + r, l, costs.AsSpan(r * m + l, h - l + 1));
                dirAt[r] = band.Offset(i + r) - l;
            }
            // Steps t at which some row is in its band, and those at which all are.
            int tStart = Math.Min(Math.Min(l0, l1 + 1), Math.Min(l2 + 2, l3 + 3));
            int tEnd = Math.Max(Math.Max(h0, h1 + 1), Math.Max(h2 + 2, h3 + 3));
            int tA = Math.Max(Math.Max(l0, l1 + 1), Math.Max(l2 + 2, l3 + 3));
            int tB = Math.Min(Math.Min(h0, h1 + 1), Math.Min(h2 + 2, h3 + 3));
            const double Inf = double.PositiveInfinity;
            // v: each row's value at its previous column (the left neighbour); w: the one before (the next row's diagonal).
            double v0 = Inf, v1 = Inf, v2 = Inf, v3 = Inf, w0 = Inf, w1 = Inf, w2 = Inf;
            for (int t = tStart; t <= tEnd; t++)
            {
                if (t == tA && tA <= tB)
                {
                    // Every row inside its band: the four rows are the four lanes of one vector, row r at
                    // column t - r, so the cell above a lane is the lane before it one step earlier and the
                    // diagonal is the previous step's "above". No bounds checks (all references start in range).
                    ref double p = ref prev[tA];
                    ref double c = ref cur[tA - 2];
                    ref double c0 = ref costs[tA], c1 = ref costs[m + tA - 1], c2 = ref costs[2 * m + tA - 2], c3 = ref costs[3 * m + tA - 3];
                    ref byte b0 = ref dirs[dirAt[0] + tA], b1 = ref dirs[dirAt[1] + tA - 1], b2 = ref dirs[dirAt[2] + tA - 2], b3 = ref dirs[dirAt[3] + tA - 3];
                    var left = Vector256.Create(v0, v1, v2, v3);
                    var diag = Vector256.Create(p, w0, w1, w2);
                    var up = diag;
                    var infinity = Vector256.Create(Inf);
                    var one = Vector256.Create(1L);
                    for (nint u = 0, steps = tB - tA; u <= steps; u++)
                    {
                        up = Avx.Blend(Avx2.Permute4x64(left, 0b10_01_00_00), Vector256.Create(Unsafe.Add(ref p, u + 1)), 0b0001);
                        var best = Avx.Min(left, Avx.Min(diag, up));
                        // Direction as in Direction(), lane-wise on all-ones masks: 1 + offDiagonal + (offDiagonal & up < left), 0 if unreachable.
                        var offDiagonal = (Avx.CompareLessThan(left, diag) | Avx.CompareLessThan(up, diag)).AsInt64();
                        var code = (one - offDiagonal - (offDiagonal & Avx.CompareLessThan(up, left).AsInt64())) & Avx.CompareLessThan(best, infinity).AsInt64();
                        var codeBytes = code.AsByte();
                        Unsafe.Add(ref b0, u) = codeBytes.GetElement(0);
                        Unsafe.Add(ref b1, u) = codeBytes.GetElement(8);
                        Unsafe.Add(ref b2, u) = codeBytes.GetElement(16);
                        Unsafe.Add(ref b3, u) = codeBytes.GetElement(24);
                        left = best + Vector256.Create(Unsafe.Add(ref c0, u), Unsafe.Add(ref c1, u), Unsafe.Add(ref c2, u), Unsafe.Add(ref c3, u));
                        Unsafe.Add(ref c, u) = left.GetElement(3);
                        diag = up;
                    }
                    (v0, v1, v2, v3) = (left.GetElement(0), left.GetElement(1), left.GetElement(2), left.GetElement(3));
                    (w0, w1, w2) = (up.GetElement(1), up.GetElement(2), up.GetElement(3));
                    t = tB;
                    continue;
                }
                // Ends of the strip, where some rows lie outside their band (+inf there).
                // (prev is read clamped: beyond column m - 1 row 0 is outside its band and the values unused.)
                double n0 = EdgeCell(t, l0, h0, prev[Math.Min(t, m)], v0, prev[Math.Min(t + 1, m)], costs, 0, dirs, dirAt[0]);
                double n1 = EdgeCell(t - 1, l1, h1, w0, v1, v0, costs, m, dirs, dirAt[1]);
                double n2 = EdgeCell(t - 2, l2, h2, w1, v2, v1, costs, 2 * m, dirs, dirAt[2]);
                double n3 = EdgeCell(t - 3, l3, h3, w2, v3, v2, costs, 3 * m, dirs, dirAt[3]);
                if (t - 3 >= l3 && t - 3 <= h3) cur[t - 2] = n3;
                w0 = v0; w1 = v1; w2 = v2;
                v0 = n0; v1 = n1; v2 = n2; v3 = n3;
            }
            (prev, cur) = (cur, prev);
            (curLo, curHi, prevLo, prevHi) = (prevLo, prevHi, l3, h3);
            i += StripRows;
        }
        var last = new double[m];
        Array.Copy(prev, 1, last, 0, m);
        return last;
    }

    /// <summary>One row of symmetric1 from the row above (both shifted by one column), the start cell first when it is in the row.</summary>
    private static void SingleRow(Span<double> prevRow, Span<double> curRow, Span<double> d, Span<byte> dir, bool startCell)
    {
        // prevRow[t] is column t - 1 of the row above (the diagonal), prevRow[t + 1] column t (up), curRow[t] column t - 1 (left).
        int start = 0;
        if (startCell)
        {
            curRow[1] = d[0];
            dir[0] = 0;
            start = 1;
        }
        double left = curRow[start];
        for (int t = start; t < d.Length; t++)
        {
            double diag = prevRow[t], up = prevRow[t + 1];
            double best = Min(left, Min(diag, up));
            dir[t] = Direction(diag, left, up, best);
            left = best + d[t];
            curRow[t + 1] = left;
        }
    }

    /// <summary>A cell of a strip row at column j, or +inf when j lies outside the row's band [l, h].</summary>
    private static double EdgeCell(int j, int l, int h, double diag, double left, double up, double[] costs, int costRow, byte[] dirs, long dirAt)
    {
        if (j < l || j > h) return double.PositiveInfinity;
        double best = Min(left, Min(diag, up));
        dirs[dirAt + j] = Direction(diag, left, up, best);
        return best + costs[costRow + j];
    }

    /// <summary>min(a, b) without a branch (minsd where available); no NaN reaches the solver.</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static double Min(double a, double b) =>
        Sse2.IsSupported ? Sse2.MinScalar(Vector128.CreateScalarUnsafe(a), Vector128.CreateScalarUnsafe(b)).ToScalar() : (a < b ? a : b);

    /// <summary>
    /// symmetric1's production taken: the first minimum in the order diagonal (1), left (2), up (3),
    /// as the R package dtw breaks ties; 0 when the cell is unreachable. Comparisons become flags, not branches.
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static byte Direction(double diag, double left, double up, double best)
    {
        int offDiagonal = Flag(left < diag) | Flag(up < diag);
        int code = 1 + offDiagonal + (offDiagonal & Flag(up < left));
        return (byte)(code & -Flag(best < double.PositiveInfinity));
    }

    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static int Flag(bool b) => Unsafe.BitCast<bool, byte>(b);

    private static DtwPath Backtrack(double[] lastRow, byte[] dirs, StepPattern pattern, Band band, DtwOptions options)
    {
        int n = band.Rows, m = band.Columns;
        int jEnd = m - 1;
        if (options.OpenEnd)
        {
            jEnd = -1;
            double bestNorm = double.PositiveInfinity;
            for (int j = band.Lo[n - 1]; j <= band.Hi[n - 1]; j++)
            {
                double v = options.CompletionCostPerColumn is double c ? lastRow[j] + c * (m - 1 - j) : lastRow[j] / pattern.Normaliser(n, j);
                if (v < bestNorm) { bestNorm = v; jEnd = j; }
            }
        }
        if (jEnd < 0 || !band.Contains(n - 1, jEnd) || double.IsPositiveInfinity(lastRow[jEnd]))
            throw new InvalidOperationException($"No warping path of {n} x {m} elements exists that the window and step pattern {pattern.Name} allow; widen the window.");
        double distance = lastRow[jEnd];

        var pi = new List<int>(n + m);
        var pj = new List<int>(n + m);
        var si = new List<int>();
        var sj = new List<int>();
        int i = n - 1, jj = jEnd;
        pi.Add(i); pj.Add(jj); si.Add(i); sj.Add(jj);
        while (true)
        {
            if (i == 0 && jj == 0 && !options.OpenBegin) break;
            byte d = dirs[band.Index(i, jj)];
            if (d == 0) break;
            var prod = pattern.Productions[d - 1];
            var cells = prod.CellArray;
            for (int s = cells.Length - 2; s >= 0; s--)
            {
                int ci = i - cells[s].BackI;
                if (ci >= 0) { pi.Add(ci); pj.Add(jj - cells[s].BackJ); }
            }
            i -= prod.OriginI;
            jj -= prod.OriginJ;
            if (i < 0) break;
            pi.Add(i); pj.Add(jj); si.Add(i); sj.Add(jj);
        }
        pi.Reverse(); pj.Reverse(); si.Reverse(); sj.Reverse();
        return new DtwPath([.. pi], [.. pj], [.. si], [.. sj], distance, distance / pattern.Normaliser(n, jEnd), jEnd);
    }
}
