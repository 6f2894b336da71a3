namespace StratLink.Alignment;

/// <summary>
/// Posterior over warping paths on one lattice, and paths drawn from it.
/// The local cost is read as a negative log-likelihood at temperature T: a path c has probability
/// proportional to exp(-C(c) / T), C being the same weighted cost the optimal path minimises (rate
/// penalty included). The forward recursion of that model is the DTW recursion with min replaced by
/// log-sum-exp, F(i,j) = log sum_p exp(F(origin_p) - cost_p / T), kept in log space as float within
/// the band. Paths are drawn by stochastic backtracking (forward filtering, backward sampling): from
/// the end cell, production p is chosen with probability exp(F(origin_p) - cost_p / T - F(i,j)),
/// which samples paths exactly from the posterior given the table.
/// </summary>
internal sealed class PathSampler<TCost> where TCost : struct, ILocalCost
{
    private readonly TCost _cost;
    private readonly Production[] _prods;
    private readonly Band _band;
    private readonly DtwOptions _options;
    private readonly double _invT;
    private readonly byte[]? _directions;
    private readonly float[] _f;
    private readonly double _endBiasPerColumn;

    /// <param name="directions">The optimal run's directions, needed only when a rate penalty is on.</param>
    /// <param name="endBiasPerColumn">Log-weight added per reference column when an open end is drawn (see <see cref="DtwCoreAligner"/>).</param>
    public PathSampler(TCost cost, StepPattern pattern, Band band, DtwOptions options, double temperature, byte[]? directions, double endBiasPerColumn, CancellationToken ct)
    {
        _cost = cost;
        _prods = [.. pattern.Productions];
        _band = band;
        _options = options;
        _invT = 1.0 / temperature;
        _directions = options.RatePenalty > 0 ? directions : null;
        _endBiasPerColumn = endBiasPerColumn;
        if (band.Cells > Array.MaxLength) throw new ArgumentException($"The band holds {band.Cells} cells, too many for one ensemble table; narrow the window or add ties.");
        _f = new float[band.Cells];
        Forward(ct);
    }

    private void Forward(CancellationToken ct)
    {
        var lo = _band.Lo;
        var hi = _band.Hi;
        Span<double> l = stackalloc double[_prods.Length];
        for (int i = 0; i < _band.Rows; i++)
        {
            if ((i & 127) == 0) ct.ThrowIfCancellationRequested();
            long off = _band.Offset(i) - lo[i];
            for (int j = lo[i]; j <= hi[i]; j++)
            {
                double d0 = _cost.Cost(i, j);
                if (i == 0 && j == 0 && !_options.OpenBegin) { _f[off + j] = (float)(-d0 * _invT); continue; }
                _f[off + j] = (float)LogSumExp(Logits(i, j, d0, l));
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
                f = _f[_band.Index(oi, oj)];
                if (double.IsNegativeInfinity(f)) continue;
            }
            else if (oi == -1 && _options.OpenBegin) f = 0;
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
            if (_directions is not null && oi >= 0)
            {
                byte od = _directions[_band.Index(oi, oj)];
                if (od != 0) c += _options.RatePenalty * Math.Abs(prod.Angle - _prods[od - 1].Angle) / DtwSolver.QuarterTurn;
            }
            l[p] = f - c * _invT;
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
        var pi = new List<int>(n + m);
        var pj = new List<int>(n + m);
        pi.Add(i); pj.Add(j);
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
                if (ci >= 0) { pi.Add(ci); pj.Add(j - cells[s].BackJ); }
            }
            i -= prod.OriginI;
            j -= prod.OriginJ;
            if (i < 0) break;
            pi.Add(i); pj.Add(j);
        }
        pi.Reverse();
        pj.Reverse();
        return ([.. pi], [.. pj]);
    }

    private int SampleEnd(Random rng)
    {
        int n = _band.Rows;
        int lo = _band.Lo[n - 1], hi = _band.Hi[n - 1];
        long off = _band.Offset(n - 1) - lo;
        double max = double.NegativeInfinity;
        for (int j = lo; j <= hi; j++) max = Math.Max(max, _f[off + j] + _endBiasPerColumn * j);
        if (double.IsNegativeInfinity(max)) throw new InvalidOperationException("No end cell of the ensemble lattice can be reached.");
        double total = 0;
        for (int j = lo; j <= hi; j++) total += Math.Exp(_f[off + j] + _endBiasPerColumn * j - max);
        double u = rng.NextDouble() * total, acc = 0;
        int pick = lo;
        for (int j = lo; j <= hi; j++)
        {
            double w = Math.Exp(_f[off + j] + _endBiasPerColumn * j - max);
            if (w == 0) continue;
            pick = j;
            acc += w;
            if (u < acc) break;
        }
        return pick;
    }
}
