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

    public static DtwPath Solve<TCost>(TCost cost, StepPattern pattern, Band band, DtwOptions options, CancellationToken ct = default)
        where TCost : struct, ILocalCost => SolveKeepingDirections(cost, pattern, band, options, ct).Path;

    /// <summary>The optimal path and the banded table of directions taken (1-based production, 0 = start or unreachable).</summary>
    internal static (DtwPath Path, byte[] Directions) SolveKeepingDirections<TCost>(TCost cost, StepPattern pattern, Band band, DtwOptions options, CancellationToken ct)
        where TCost : struct, ILocalCost
    {
        Validate(pattern, options);
        if (band.Rows == 0 || band.Columns == 0) throw new ArgumentException("Both series need at least one element.");
        if (band.Cells > Array.MaxLength) throw new ArgumentException($"The band holds {band.Cells} cells, more than one alignment can store; narrow the window or coarsen the grid step.");
        // Every cell is written before it is read: no need to zero the table.
        var dirs = GC.AllocateUninitializedArray<byte>((int)band.Cells);
        double[] lastRow = ReferenceEquals(pattern, StepPattern.Symmetric1) && !options.OpenBegin && options.RatePenalty == 0
            ? FillSymmetric1(cost, band, dirs, ct)
            : Fill(cost, pattern, band, options, dirs, ct);
        return (Backtrack(lastRow, dirs, pattern, band, options), dirs);
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

    /// <summary>symmetric1 (g = d + min of the three neighbours) with two rolling rows: the hot path of plain DTW.</summary>
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
        var rowCost = new double[m];
        long k = 0;
        for (int i = 0; i < n; i++)
        {
            if ((i & 255) == 0) ct.ThrowIfCancellationRequested();
            int l = lo[i], h = hi[i];
            if (curHi >= curLo) Array.Fill(cur, double.PositiveInfinity, curLo + 1, curHi - curLo + 1);
            if (h < l) { (prev, cur) = (cur, prev); (curLo, curHi, prevLo, prevHi) = (prevLo, prevHi, l, h); continue; }
            var d = rowCost.AsSpan(0, h - l + 1);
            cost.Row(i, l, d);
            // prevRow[j] is column j - 1 of row i - 1 (the diagonal), prevRow[j + 1] column j (up), curRow[j] column j - 1 (left).
            var prevRow = prev.AsSpan(l, h - l + 2);
            var curRow = cur.AsSpan(l, h - l + 2);
            var dir = dirs.AsSpan((int)k, h - l + 1);
            int start = 0;
            if (i == 0 && l == 0)
            {
                curRow[1] = d[0];
                dir[0] = 0;
                start = 1;
            }
            double left = curRow[start];
            for (int t = start; t < d.Length; t++)
            {
                double diag = prevRow[t], up = prevRow[t + 1];
                // Only min(left, min(diag, up)) + d is on the serial chain along the row; the
                // direction (first minimum in the order diagonal, left, up) is computed beside it.
                double du = up < diag ? up : diag;
                double best = left < du ? left : du;
                int code = left < diag ? (up < left ? 3 : 2) : (up < diag ? 3 : 1);
                dir[t] = best == double.PositiveInfinity ? (byte)0 : (byte)code;
                left = best + d[t];
                curRow[t + 1] = left;
            }
            k += d.Length;
            (prev, cur) = (cur, prev);
            (curLo, curHi, prevLo, prevHi) = (prevLo, prevHi, l, h);
        }
        var last = new double[m];
        Array.Copy(prev, 1, last, 0, m);
        return last;
    }

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
