using System.Runtime.CompilerServices;
using System.Runtime.Intrinsics;
using System.Runtime.Intrinsics.X86;

namespace StratLink.Alignment;

/// <summary>
/// Optimal dynamic time warping over a banded lattice. Memory: two bits per band cell for the
/// backtracking direction (<see cref="StepDirections"/>) and a few rolling rows of accumulated
/// cost; no n x m matrix of doubles.
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

    /// <summary>The optimal path. The table of directions is needed only until the path is traced; it goes back to the pool.</summary>
    public static DtwPath Solve<TCost>(TCost cost, StepPattern pattern, Band band, DtwOptions options, CancellationToken ct = default)
        where TCost : struct, ILocalCost
    {
        CheckLattice(pattern, band, options);
        using var dirs = new StepDirections(band);
        return FillAndTrace(cost, pattern, band, options, dirs, ct);
    }

    /// <summary>The optimal path and the table of directions taken; the caller disposes the table (it is rented).</summary>
    internal static (DtwPath Path, StepDirections Directions) SolveKeepingDirections<TCost>(TCost cost, StepPattern pattern, Band band, DtwOptions options, CancellationToken ct)
        where TCost : struct, ILocalCost
    {
        CheckLattice(pattern, band, options);
        var dirs = new StepDirections(band);
        try
        {
            return (FillAndTrace(cost, pattern, band, options, dirs, ct), dirs);
        }
        catch
        {
            dirs.Dispose();
            throw;
        }
    }

    private static void CheckLattice(StepPattern pattern, Band band, DtwOptions options)
    {
        Validate(pattern, options);
        if (band.Rows == 0 || band.Columns == 0) throw new ArgumentException("Both series need at least one element.");
        if (pattern.Productions.Count > StepDirections.MaxProductions)
            throw new ArgumentException($"Step pattern {pattern.Name} has {pattern.Productions.Count} productions; the solver stores at most {StepDirections.MaxProductions}.");
    }

    /// <summary>Fills <paramref name="dirs"/> (every reachable band cell but the start is written) and traces the path back.</summary>
    private static DtwPath FillAndTrace<TCost>(TCost cost, StepPattern pattern, Band band, DtwOptions options, StepDirections dirs, CancellationToken ct)
        where TCost : struct, ILocalCost
    {
        double[] lastRow = ReferenceEquals(pattern, StepPattern.Symmetric1) && !options.OpenBegin && options.RatePenalty == 0
            ? FillSymmetric1(cost, band, dirs, ct)
            : options.RatePenalty == 0 && ThreeMoveWeights(pattern) is { } w
                ? FillThreeMoves(cost, band, options, w.Diagonal, w.Left, w.Up, dirs, ct)
                : Fill(cost, pattern, band, options, dirs, ct);
        return Backtrack(lastRow, dirs, pattern, band, options);
    }

    /// <summary>
    /// The weights of a pattern made of the three unit moves diagonal, left, up in that order, each
    /// weighting only the cell it reaches (symmetric1, symmetric2); null for any other pattern.
    /// </summary>
    private static (double Diagonal, double Left, double Up)? ThreeMoveWeights(StepPattern pattern)
    {
        var p = pattern.Productions;
        if (p.Count != 3 || p.Any(q => q.Cells.Count != 1)) return null;
        if ((p[0].OriginI, p[0].OriginJ, p[1].OriginI, p[1].OriginJ, p[2].OriginI, p[2].OriginJ) != (1, 1, 0, 1, 1, 0)) return null;
        return (p[0].Cells[0].Weight, p[1].Cells[0].Weight, p[2].Cells[0].Weight);
    }

    /// <summary>
    /// The recursion of <see cref="Fill"/> for three-move patterns, on rolling rows with one cost row
    /// at a time and no branches in the inner loop: g(i, j) = min(g(i-1, j-1) + wd d, g(i, j-1) + wl d,
    /// g(i-1, j) + wu d), the first minimum in that order, and the same sums in the same order, so
    /// distances and paths equal the general loop's bit for bit. Under an open begin the row before
    /// the first holds the completion cost of the reference columns skipped.
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static double[] FillThreeMoves<TCost>(TCost cost, Band band, DtwOptions options, double wDiagonal, double wLeft, double wUp,
        StepDirections dirs, CancellationToken ct)
        where TCost : struct, ILocalCost
    {
        int n = band.Rows, m = band.Columns;
        // Rows are shifted by one: index 0 is a sentinel +inf column left of column 0.
        var prev = new double[m + 1];
        var cur = new double[m + 1];
        Array.Fill(cur, double.PositiveInfinity);
        prev[0] = double.PositiveInfinity;
        bool openBegin = options.OpenBegin;
        double completion = options.CompletionCostPerColumn ?? 0;
        for (int j = 0; j < m; j++) prev[j + 1] = openBegin ? completion * j : double.PositiveInfinity;
        // The virtual row fills all of prev: clear it whole the first time.
        int prevLo = 0, prevHi = m - 1, curLo = 0, curHi = -1;
        var d = new double[m];
        var bytes = dirs.Bytes;
        var lo = band.Lo;
        var hi = band.Hi;
        for (int i = 0; i < n; i++)
        {
            if ((i & 255) == 0) ct.ThrowIfCancellationRequested();
            if (curHi >= curLo) Array.Fill(cur, double.PositiveInfinity, curLo + 1, curHi - curLo + 1);
            int l = lo[i], h = hi[i];
            if (h >= l)
            {
                cost.Row(i, l, d.AsSpan(0, h - l + 1));
                long rowByte = dirs.RowByte(i);
                int t = 0;
                if (i == 0 && l == 0 && !openBegin)
                {
                    cur[1] = d[0];
                    t = 1;
                }
                double left = cur[l + t];
                for (; t <= h - l; t++)
                {
                    double d0 = d[t];
                    double cDiagonal = prev[l + t] + wDiagonal * d0, cUp = prev[l + t + 1] + wUp * d0, cLeft = left + wLeft * d0;
                    left = Min(Min(cDiagonal, cUp), cLeft);
                    cur[l + t + 1] = left;
                    StepDirections.Set(bytes, rowByte, t, Direction(cDiagonal, cLeft, cUp));
                }
            }
            (prev, cur) = (cur, prev);
            (curLo, curHi, prevLo, prevHi) = (prevLo, prevHi, l, h);
        }
        var last = new double[m];
        Array.Copy(prev, 1, last, 0, m);
        return last;
    }

    private static double[] Fill<TCost>(TCost cost, StepPattern pattern, Band band, DtwOptions options, StepDirections dirs, CancellationToken ct)
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
            for (int j = lo[i]; j <= hi[i]; j++)
            {
                double d0 = cost.Cost(i, j);
                if (i == 0 && j == 0 && !openBegin)
                {
                    row[0] = d0;
                    continue;
                }
                double best = double.PositiveInfinity;
                int bp = 0;
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
                    // The start cell has no production of its own to turn from.
                    if (penalty > 0 && oi >= 0 && band.Contains(oi, oj) && (oi != 0 || oj != 0 || openBegin))
                        c += penalty * Math.Abs(prod.Angle - prods[dirs[oi, oj]].Angle) / QuarterTurn;
                    if (c < best) { best = c; bp = p; }
                }
                row[j] = best;
                dirs.Set(i, j, bp);
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
    private static double[] FillSymmetric1<TCost>(TCost cost, Band band, StepDirections directions, CancellationToken ct)
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
        var dirs = directions.Bytes;
        Span<long> rowByte = stackalloc long[StripRows];
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
                    SingleRow(prev.AsSpan(l, h - l + 2), cur.AsSpan(l, h - l + 2), d, dirs, directions.RowByte(i), i == 0 && l == 0);
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
                rowByte[r] = directions.RowByte(i + r);
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
                    // Two bits a cell: each lane gathers its row's codes in a byte (shift 2 q mod 8 for the
                    // row's q-th cell) and stores the byte at every step; a new byte starts from zero, and
                    // one begun by the edge cells before the loop starts from what they wrote.
                    int q0 = tA - l0, q1 = tA - 1 - l1, q2 = tA - 2 - l2, q3 = tA - 3 - l3;
                    ref byte b0 = ref dirs[rowByte[0] + (q0 >> 2)], b1 = ref dirs[rowByte[1] + (q1 >> 2)], b2 = ref dirs[rowByte[2] + (q2 >> 2)], b3 = ref dirs[rowByte[3] + (q3 >> 2)];
                    int p0 = q0 & 3, p1 = q1 & 3, p2 = q2 & 3, p3 = q3 & 3;
                    var shift = Vector256.Create(2L * p0, 2L * p1, 2L * p2, 2L * p3);
                    var packed = Vector256.Create(b0 & ((1L << (2 * p0)) - 1), b1 & ((1L << (2 * p1)) - 1), b2 & ((1L << (2 * p2)) - 1), b3 & ((1L << (2 * p3)) - 1));
                    var left = Vector256.Create(v0, v1, v2, v3);
                    var diag = Vector256.Create(p, w0, w1, w2);
                    var up = diag;
                    var two = Vector256.Create(2L);
                    var six = Vector256.Create(6L);
                    for (nint u = 0, steps = tB - tA; u <= steps; u++)
                    {
                        up = Avx.Blend(Avx2.Permute4x64(left, 0b10_01_00_00), Vector256.Create(Unsafe.Add(ref p, u + 1)), 0b0001);
                        var best = Avx.Min(left, Avx.Min(diag, up));
                        // Direction as in Direction(), lane-wise on all-ones masks: offDiagonal + (offDiagonal & up < left).
                        var offDiagonal = (Avx.CompareLessThan(left, diag) | Avx.CompareLessThan(up, diag)).AsInt64();
                        var code = Vector256<long>.Zero - offDiagonal - (offDiagonal & Avx.CompareLessThan(up, left).AsInt64());
                        packed = Avx2.AndNot(Avx2.CompareEqual(shift, Vector256<long>.Zero), packed) | Avx2.ShiftLeftLogicalVariable(code, shift.AsUInt64());
                        var packedBytes = packed.AsByte();
                        Unsafe.Add(ref b0, (p0 + u) >> 2) = packedBytes.GetElement(0);
                        Unsafe.Add(ref b1, (p1 + u) >> 2) = packedBytes.GetElement(8);
                        Unsafe.Add(ref b2, (p2 + u) >> 2) = packedBytes.GetElement(16);
                        Unsafe.Add(ref b3, (p3 + u) >> 2) = packedBytes.GetElement(24);
                        shift = (shift + two) & six;
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
                double n0 = EdgeCell(t, l0, h0, prev[Math.Min(t, m)], v0, prev[Math.Min(t + 1, m)], costs, 0, dirs, rowByte[0]);
                double n1 = EdgeCell(t - 1, l1, h1, w0, v1, v0, costs, m, dirs, rowByte[1]);
                double n2 = EdgeCell(t - 2, l2, h2, w1, v2, v1, costs, 2 * m, dirs, rowByte[2]);
                double n3 = EdgeCell(t - 3, l3, h3, w2, v3, v2, costs, 3 * m, dirs, rowByte[3]);
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
    private static void SingleRow(Span<double> prevRow, Span<double> curRow, Span<double> d, byte[] dirs, long rowByte, bool startCell)
    {
        // prevRow[t] is column t - 1 of the row above (the diagonal), prevRow[t + 1] column t (up), curRow[t] column t - 1 (left).
        int start = 0;
        if (startCell)
        {
            curRow[1] = d[0];
            start = 1;
        }
        double left = curRow[start];
        for (int t = start; t < d.Length; t++)
        {
            double diag = prevRow[t], up = prevRow[t + 1];
            double best = Min(left, Min(diag, up));
            StepDirections.Set(dirs, rowByte, t, Direction(diag, left, up));
            left = best + d[t];
            curRow[t + 1] = left;
        }
    }

    /// <summary>A cell of a strip row at column j, or +inf when j lies outside the row's band [l, h].</summary>
    private static double EdgeCell(int j, int l, int h, double diag, double left, double up, double[] costs, int costRow, byte[] dirs, long rowByte)
    {
        if (j < l || j > h) return double.PositiveInfinity;
        double best = Min(left, Min(diag, up));
        StepDirections.Set(dirs, rowByte, j - l, Direction(diag, left, up));
        return best + costs[costRow + j];
    }

    /// <summary>min(a, b) without a branch (minsd where available); no NaN reaches the solver.</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static double Min(double a, double b) =>
        Sse2.IsSupported ? Sse2.MinScalar(Vector128.CreateScalarUnsafe(a), Vector128.CreateScalarUnsafe(b)).ToScalar() : (a < b ? a : b);

    /// <summary>
    /// The three-move production taken: the first minimum in the order diagonal (0), left (1), up (2),
    /// as the R package dtw breaks ties (meaningless for an unreachable cell, which is never traced).
    /// Comparisons become flags, not branches.
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static int Direction(double diag, double left, double up)
    {
        int offDiagonal = Flag(left < diag) | Flag(up < diag);
        return offDiagonal + (offDiagonal & Flag(up < left));
    }

    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static int Flag(bool b) => Unsafe.BitCast<bool, byte>(b);

    private static DtwPath Backtrack(double[] lastRow, StepDirections dirs, StepPattern pattern, Band band, DtwOptions options)
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
            var prod = pattern.Productions[dirs[i, jj]];
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
