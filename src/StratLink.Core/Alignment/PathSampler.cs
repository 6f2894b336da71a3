using System.Buffers;

namespace StratLink.Alignment;

/// <summary>
/// Posterior over warping paths on one lattice, and paths drawn from it.
/// The local cost is read as a negative log-likelihood at temperature T: a path c has probability
/// proportional to exp(-C(c) / T), C being the same weighted cost the optimal path minimises (rate
/// penalty included). The forward recursion of that model is the DTW recursion with min replaced by
/// a sum of exponentials, F(i,j) = log sum_p exp(F(origin_p) - cost_p / T). It is run in linear
/// space with one scale per row (P(i,j) = exp(F(i,j) - s_i), each row's largest P = 1, so one
/// exponential per cell) and stored as float log P within the band (a float P would flush the
/// tiny values a sampled path can still need to zero).
/// Paths are drawn by stochastic backtracking (forward filtering, backward sampling): from the end
/// cell, production p is chosen with probability exp(F(origin_p) - cost_p / T - F(i,j)), which draws
/// paths exactly from the posterior given the table. The table is rented from the shared pool and
/// returned on <see cref="Dispose"/>, so the segments and cores of a run reuse the same pages.
/// </summary>
internal sealed class PathSampler<TCost> : IDisposable where TCost : struct, ILocalCost
{
    private readonly TCost _cost;
    private readonly Production[] _prods;
    private readonly Band _band;
    private readonly DtwOptions _options;
    private readonly double _invT;
    private readonly StepDirections? _directions;
    private float[] _logP;
    private readonly double[] _rowLogScale;
    private readonly double _endBiasPerColumn;
    private readonly double _startCostPerColumn;
    private int[]? _pathI;
    private int[]? _pathJ;

    /// <param name="directions">The optimal run's directions, needed only when a rate penalty is on.</param>
    /// <param name="endBiasPerColumn">Log-weight added per reference column when an open end is drawn (see <see cref="DtwCoreAligner"/>).</param>
    public PathSampler(TCost cost, StepPattern pattern, Band band, DtwOptions options, double temperature, StepDirections? directions, double endBiasPerColumn, CancellationToken ct)
    {
        _cost = cost;
        _prods = [.. pattern.Productions];
        _band = band;
        _options = options;
        _invT = 1.0 / temperature;
        _directions = options.RatePenalty > 0 ? directions : null;
        _endBiasPerColumn = endBiasPerColumn;
        _startCostPerColumn = options.CompletionCostPerColumn ?? 0;
        if (band.Cells > Array.MaxLength) throw new ArgumentException($"The band holds {band.Cells} cells, too many for one ensemble table; narrow the window or add ties.");
        _logP = ArrayPool<float>.Shared.Rent((int)Math.Max(1, band.Cells));
        _rowLogScale = new double[band.Rows];
        Forward(ct);
    }

    /// <summary>log P of a band cell plus its row's scale: F(i, j); -inf where unreachable.</summary>
    private double F(int i, int j) => _logP[_band.Index(i, j)] + _rowLogScale[i];

    private double PenaltyOf(Production prod, int oi, int oj)
    {
        // The start cell has no production of its own to turn from.
        if (_directions is null || oi < 0 || (oi == 0 && oj == 0 && !_options.OpenBegin)) return 0;
        return _options.RatePenalty * Math.Abs(prod.Angle - _prods[_directions[oi, oj]].Angle) / DtwSolver.QuarterTurn;
    }

    public void Dispose()
    {
        if (_logP.Length > 0) ArrayPool<float>.Shared.Return(_logP);
        _logP = [];
    }

    private void Forward(CancellationToken ct)
    {
        int n = _band.Rows, m = _band.Columns;
        int k = _prods.Max(p => p.OriginI) + 1;
        var lo = _band.Lo;
        var hi = _band.Hi;
        // Rolling rows: e = exp(-d / T) and P (each row relative to its own scale), zero outside the band.
        var eRing = new double[k][];
        var pRing = new double[k][];
        for (int r = 0; r < k; r++) { eRing[r] = new double[m]; pRing[r] = new double[m]; }
        var dRow = new double[m];
        var adjust = new double[k + 1];
        for (int i = 0; i < n; i++)
        {
            if ((i & 127) == 0) ct.ThrowIfCancellationRequested();
            int slot = i % k;
            var eRow = eRing[slot];
            var pRow = pRing[slot];
            Array.Clear(eRow);
            Array.Clear(pRow);
            double prevScale = i > 0 ? _rowLogScale[i - 1] : 0;
            // Factor bringing row i - b to the scale of row i - 1 (row i itself is built on that scale).
            for (int b = 1; b <= k; b++) adjust[b] = i - b >= 0 ? Math.Exp(_rowLogScale[i - b] - prevScale) : Math.Exp(-prevScale);
            adjust[0] = 1;
            int l = lo[i], h = hi[i];
            if (h < l) { _rowLogScale[i] = prevScale; continue; }
            var d = dRow.AsSpan(0, h - l + 1);
            _cost.Row(i, l, d);
            for (int t = 0; t < d.Length; t++) eRow[l + t] = Math.Exp(-d[t] * _invT);
            for (int j = l; j <= h; j++)
            {
                if (i == 0 && j == 0 && !_options.OpenBegin) { pRow[0] = eRow[0]; continue; }
                double sum = 0;
                foreach (var prod in _prods)
                {
                    int oi = i - prod.OriginI, oj = j - prod.OriginJ;
                    if (oj < 0) continue;
                    double v;
                    if (oi >= 0) v = pRing[oi % k][oj] * adjust[prod.OriginI];
                    else if (oi == -1 && _options.OpenBegin) v = adjust[prod.OriginI] * Math.Exp(-_startCostPerColumn * oj * _invT);
                    else continue;
                    if (v == 0) continue;
                    foreach (var st in prod.CellArray)
                    {
                        int ci = i - st.BackI, cj = j - st.BackJ;
                        if (ci < 0) continue; // the virtual row of an open begin costs nothing
                        if (st.BackI != 0 || st.BackJ != 0)
                        {
                            if (_options.StrictBand && !_band.Contains(ci, cj)) { v = 0; break; }
                            if (!_band.Contains(ci, cj)) { v *= Math.Exp(-st.Weight * _cost.Cost(ci, cj) * _invT); continue; }
                        }
                        double e = eRing[ci % k][cj];
                        v *= st.Weight == 1 ? e : st.Weight == 2 ? e * e : Math.Pow(e, st.Weight);
                    }
                    if (_directions is not null && oi >= 0) v *= Math.Exp(-PenaltyOf(prod, oi, oj) * _invT);
                    sum += v;
                }
                pRow[j] = sum;
            }
            double max = 0;
            for (int j = l; j <= h; j++) max = Math.Max(max, pRow[j]);
            long off = _band.Offset(i) - l;
            if (max > 0)
            {
                double inv = 1 / max;
                for (int j = l; j <= h; j++) { pRow[j] *= inv; _logP[off + j] = (float)Math.Log(pRow[j]); }
                _rowLogScale[i] = prevScale + Math.Log(max);
            }
            else
            {
                for (int j = l; j <= h; j++) _logP[off + j] = float.NegativeInfinity;
                _rowLogScale[i] = prevScale;
            }
        }
    }

    /// <summary>Log-weights of reaching (i, j) by each production (-inf where it cannot).</summary>
    private Span<double> Logits(int i, int j, double d0, Span<double> l)
    {
        for (int p = 0; p < _prods.Length; p++)
        {
            var prod = _prods[p];
            l[p] = double.NegativeInfinity;
            int oi = i - prod.OriginI, oj = j - prod.OriginJ;
            if (oj < 0) continue;
            double f;
            if (oi >= 0)
            {
                if (!_band.Contains(oi, oj)) continue;
                f = F(oi, oj);
                if (double.IsNegativeInfinity(f)) continue;
            }
            else if (oi == -1 && _options.OpenBegin) f = -_startCostPerColumn * oj * _invT;
            else continue;
            double c = 0;
            bool ok = true;
            foreach (var st in prod.CellArray)
            {
                if (st.BackI == 0 && st.BackJ == 0) { c += st.Weight * d0; continue; }
                int ci = i - st.BackI, cj = j - st.BackJ;
                if (ci < 0) continue;
                if (_options.StrictBand && !_band.Contains(ci, cj)) { ok = false; break; }
                c += st.Weight * _cost.Cost(ci, cj);
            }
            if (!ok) continue;
            l[p] = f - (c + PenaltyOf(prod, oi, oj)) * _invT;
        }
        return l;
    }

    private static double LogSumExp(ReadOnlySpan<double> v)
    {
        double max = double.NegativeInfinity;
        foreach (double x in v) if (x > max) max = x;
        if (double.IsNegativeInfinity(max)) return max;
        double s = 0;
        foreach (double x in v) s += Math.Exp(x - max);
        return max + Math.Log(s);
    }

    /// <summary>One path drawn from the posterior: 0-based cells from the first to the last.</summary>
    public (int[] I, int[] J) Sample(Random rng)
    {
        int n = _band.Rows, m = _band.Columns;
        int i = n - 1, j = m - 1;
        if (_options.OpenEnd) j = SampleEnd(rng);
        // The path is traced from its end, so cells go into the scratch rows from the back; only the
        // part used is copied out. A path visits at most n + m cells.
        _pathI ??= new int[n + m];
        _pathJ ??= new int[n + m];
        var pi = _pathI;
        var pj = _pathJ;
        int k = n + m;
        pi[--k] = i; pj[k] = j;
        Span<double> l = stackalloc double[_prods.Length];
        while (!(i == 0 && j == 0 && !_options.OpenBegin))
        {
            Logits(i, j, _cost.Cost(i, j), l);
            double lse = LogSumExp(l);
            if (double.IsNegativeInfinity(lse)) throw new InvalidOperationException($"Cell ({i}, {j}) of the ensemble lattice cannot be reached.");
            double u = rng.NextDouble(), acc = 0;
            int pick = -1;
            for (int p = 0; p < l.Length; p++)
            {
                if (double.IsNegativeInfinity(l[p])) continue;
                pick = p;
                acc += Math.Exp(l[p] - lse);
                if (u < acc) break;
            }
            var prod = _prods[pick];
            var cells = prod.CellArray;
            for (int s = cells.Length - 2; s >= 0; s--)
            {
                int ci = i - cells[s].BackI;
                if (ci >= 0) { pi[--k] = ci; pj[k] = j - cells[s].BackJ; }
            }
            i -= prod.OriginI;
            j -= prod.OriginJ;
            if (i < 0) break;
            pi[--k] = i; pj[k] = j;
        }
        return (pi.AsSpan(k).ToArray(), pj.AsSpan(k).ToArray());
    }

    private int SampleEnd(Random rng)
    {
        int n = _band.Rows;
        int lo = _band.Lo[n - 1], hi = _band.Hi[n - 1];
        // One row, one scale: log P suffices.
        var f = new double[hi - lo + 1];
        for (int j = lo; j <= hi; j++) f[j - lo] = F(n - 1, j) + _endBiasPerColumn * j;
        double max = double.NegativeInfinity;
        foreach (double v in f) max = Math.Max(max, v);
        if (double.IsNegativeInfinity(max)) throw new InvalidOperationException("No end cell of the ensemble lattice can be reached.");
        double total = 0;
        foreach (double v in f) total += Math.Exp(v - max);
        double u = rng.NextDouble() * total, acc = 0;
        int pick = lo;
        for (int j = lo; j <= hi; j++)
        {
            double w = Math.Exp(f[j - lo] - max);
            if (w == 0) continue;
            pick = j;
            acc += w;
            if (u < acc) break;
        }
        return pick;
    }
}
