using StratLink.Alignment;

namespace StratLink.Tests.Alignment;

/// <summary>
/// Check values computed with the R package dtw 1.23-2 (Giorgino 2009, J. Stat. Softw. 31(7)) on
/// R 4.2.2 with proxy 0.4-27; every case was verified free of ties, so paths must match exactly.
/// Distances to 1e-9 (absolute; the values are of order 1-30).
/// </summary>
public class RDtwCheckValueTests
{
    private static readonly double[] X = [1.20, 1.90, 3.10, 4.05, 3.60, 2.20, 1.15, 0.70, 1.40, 2.65];
    private static readonly double[] Y = [1.00, 1.35, 2.05, 2.95, 3.85, 4.20, 3.70, 2.55, 1.60, 0.80, 0.95, 1.75, 2.80];
    private static readonly double[] Q = [3.30, 2.95, 2.05, 1.45, 0.85, 1.35, 2.70, 3.20];
    private static readonly double[] Qe = [0.25, 0.90, 1.70, 2.60, 3.50, 3.00, 2.10, 1.20];
    private static readonly double[] R = [0.30, 0.80, 1.60, 2.70, 3.40, 3.10, 2.20, 1.30, 0.90, 1.50, 2.60, 3.30, 2.90, 1.80, 1.00, 0.60];
    private static readonly double[] Xs = [4.10, 3.20, 2.00, 1.10, 0.60, 0.80, 1.70, 2.90, 3.60, 3.30, 2.40, 1.50, 1.00, 0.70];
    private static readonly double[] Ys = [0.57, 0.83, 1.76, 3.02, 3.94, 4.07, 3.21, 1.98, 1.13, 0.52, 0.88, 1.66, 2.93, 3.58, 3.31, 2.47];

    private static readonly double[,] Xm = Columns(
        [0.00, 0.50, 1.20, 2.00, 2.60, 3.10, 3.30, 3.00, 2.40, 1.50],
        [1.00, 1.30, 1.10, 0.60, 0.20, 0.40, 1.00, 1.60, 2.10, 2.30]);

    private static readonly double[,] Ym = Columns(
        [0.10, 0.30, 0.90, 1.60, 2.30, 2.80, 3.20, 3.40, 3.20, 2.70, 2.00, 1.40],
        [0.90, 1.20, 1.25, 0.90, 0.45, 0.15, 0.50, 0.95, 1.50, 1.95, 2.25, 2.40]);

    private const double Tol = 1e-9;

    private static double[,] Columns(double[] c1, double[] c2)
    {
        var m = new double[c1.Length, 2];
        for (int i = 0; i < c1.Length; i++) { m[i, 0] = c1[i]; m[i, 1] = c2[i]; }
        return m;
    }

    private static void Expect(PairResult r, double distance, double? normalised, int[] index1, int[] index2)
    {
        Assert.Equal(distance, r.Distance, Tol);
        if (normalised is double nd) Assert.Equal(nd, r.NormalisedDistance!.Value, Tol);
        else Assert.Null(r.NormalisedDistance);
        Assert.Equal(index1, r.IndexA);
        Assert.Equal(index2, r.IndexB);
    }

    [Fact]
    public void A1_symmetric1() => Expect(
        PairAligner.Align(X, Y, new PairOptions { Pattern = StepPattern.Symmetric1 }),
        2.75, null, [1, 1, 2, 3, 4, 4, 5, 6, 7, 8, 8, 9, 10], [1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12, 13]);

    [Fact]
    public void A2_symmetric2() => Expect(
        PairAligner.Align(X, Y, new PairOptions { Pattern = StepPattern.Symmetric2 }),
        4.7499999999999991, 0.20652173913043476, [1, 1, 2, 3, 4, 4, 5, 6, 7, 8, 8, 9, 10], [1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12, 13]);

    [Fact]
    public void A3_asymmetric() => Expect(
        PairAligner.Align(X, Y, new PairOptions { Pattern = StepPattern.Asymmetric }),
        2.0499999999999998, 0.20499999999999999, [1, 2, 3, 4, 5, 6, 7, 8, 9, 10], [1, 3, 4, 6, 7, 8, 10, 10, 12, 13]);

    [Fact]
    public void A4_rabinerJuang4c()
    {
        var r = PairAligner.Align(X, Y, new PairOptions { Pattern = StepPattern.RabinerJuang4c });
        Expect(r, 2.0499999999999998, 0.20499999999999999, [1, 2, 3, 4, 5, 6, 7, 8, 9, 10], [1, 3, 4, 6, 7, 8, 10, 10, 12, 13]);
        Assert.Equal([1, 2, 3, 4, 5, 6, 8, 9, 10], r.StepEndsA);
        Assert.Equal([1, 3, 4, 6, 7, 8, 10, 12, 13], r.StepEndsB);
    }

    [Fact]
    public void A5_typeIIIc()
    {
        var r = PairAligner.Align(X, Y, new PairOptions { Pattern = StepPattern.TypeIIIc });
        Expect(r, 2.0499999999999998, 0.20499999999999999, [1, 2, 3, 4, 5, 6, 7, 8, 9, 10], [1, 3, 4, 6, 7, 8, 10, 10, 12, 13]);
        Assert.Equal([1, 2, 3, 4, 5, 6, 8, 9, 10], r.StepEndsA);
        Assert.Equal([1, 3, 4, 6, 7, 8, 10, 12, 13], r.StepEndsB);
    }

    [Fact]
    public void B0_symmetric2() => Expect(
        PairAligner.Align(Xs, Ys, new PairOptions { Pattern = StepPattern.Symmetric2 }),
        15.399999999999999, 0.51333333333333331,
        [1, 1, 1, 1, 1, 1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12, 13, 14],
        [1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12, 13, 14, 15, 16, 16, 16, 16]);

    [Fact]
    public void B1_symmetric1_window3() => Expect(
        PairAligner.Align(Xs, Ys, new PairOptions { Pattern = StepPattern.Symmetric1, Window = 3 }),
        21.59, null,
        [1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12, 12, 12, 12, 12, 12, 13, 14],
        [1, 2, 2, 2, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12, 13, 14, 15, 16]);

    [Fact]
    public void B2_symmetric2_window3() => Expect(
        PairAligner.Align(Xs, Ys, new PairOptions { Pattern = StepPattern.Symmetric2, Window = 3 }),
        29.410000000000004, 0.9803333333333335,
        [1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12, 13, 13, 14, 14, 14, 14, 14, 14],
        [1, 1, 1, 2, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 11, 12, 13, 14, 15, 16]);

    [Fact]
    public void B3_asymmetric_window3() => Expect(
        PairAligner.Align(Xs, Ys, new PairOptions { Pattern = StepPattern.Asymmetric, Window = 3 }),
        18.449999999999999, 1.3178571428571428,
        [1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12, 13, 14],
        [1, 3, 3, 3, 3, 3, 4, 5, 7, 8, 10, 12, 14, 16]);

    [Fact]
    public void B4_rabinerJuang4c_window3()
    {
        var r = PairAligner.Align(Xs, Ys, new PairOptions { Pattern = StepPattern.RabinerJuang4c, Window = 3 });
        Expect(r, 19.719999999999995, 1.4085714285714281,
            [1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12, 13, 14],
            [1, 3, 5, 7, 9, 9, 11, 11, 13, 13, 15, 15, 16, 16]);
        Assert.Equal([1, 2, 3, 4, 6, 8, 10, 12, 14], r.StepEndsA);
        Assert.Equal([1, 3, 5, 7, 9, 11, 13, 15, 16], r.StepEndsB);
    }

    [Fact]
    public void C1_symmetric2_openEnd()
    {
        var r = PairAligner.Align(Qe, R, new PairOptions { Pattern = StepPattern.Symmetric2, OpenEnd = true });
        Expect(r, 1.4500000000000006, 0.090625000000000039, [1, 2, 3, 4, 5, 6, 7, 8], [1, 2, 3, 4, 5, 6, 7, 8]);
        Assert.Equal(8, r.EndIndexB);
    }

    [Fact]
    public void C2_asymmetric_openEnd()
    {
        var r = PairAligner.Align(Qe, R, new PairOptions { Pattern = StepPattern.Asymmetric, OpenEnd = true });
        Expect(r, 0.75000000000000022, 0.093750000000000028, [1, 2, 3, 4, 5, 6, 7, 8], [1, 2, 3, 4, 5, 6, 7, 8]);
        Assert.Equal(8, r.EndIndexB);
    }

    [Fact]
    public void C3_asymmetric_openBegin_openEnd()
    {
        var r = PairAligner.Align(Q, R, new PairOptions { Pattern = StepPattern.Asymmetric, OpenBegin = true, OpenEnd = true });
        Expect(r, 0.94999999999999996, 0.11874999999999999, [1, 2, 3, 4, 5, 6, 7, 8], [5, 6, 7, 8, 9, 10, 11, 12]);
        Assert.Equal(12, r.EndIndexB);
    }

    [Fact]
    public void C4_rabinerJuang4c_openBegin_openEnd()
    {
        var r = PairAligner.Align(Q, R, new PairOptions { Pattern = StepPattern.RabinerJuang4c, OpenBegin = true, OpenEnd = true });
        Expect(r, 0.94999999999999996, 0.11874999999999999, [1, 2, 3, 4, 5, 6, 7, 8], [5, 6, 7, 8, 9, 10, 11, 12]);
        Assert.Equal(12, r.EndIndexB);
    }

    [Fact]
    public void C5_asymmetric_openBegin()
    {
        var r = PairAligner.Align(Q, R, new PairOptions { Pattern = StepPattern.Asymmetric, OpenBegin = true });
        Expect(r, 5.4500000000000011, 0.68125000000000013, [1, 2, 3, 4, 5, 6, 7, 8], [12, 13, 14, 14, 15, 15, 15, 16]);
        Assert.Equal(16, r.EndIndexB);
    }

    [Fact]
    public void D1_multivariate_symmetric2() => Expect(
        PairAligner.Align(Xm, Ym, new PairOptions { Pattern = StepPattern.Symmetric2 }),
        5.1243262950138551, 0.23292392250062977,
        [1, 2, 3, 3, 4, 5, 6, 7, 8, 9, 9, 10], [1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12]);

    [Fact]
    public void D2_multivariate_symmetric1() => Expect(
        PairAligner.Align(Xm, Ym, new PairOptions { Pattern = StepPattern.Symmetric1 }),
        3.0700807170084996, null,
        [1, 2, 3, 3, 4, 5, 6, 7, 8, 9, 9, 10], [1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12]);

    [Fact]
    public void D3_multivariate_symmetric2_window3() => Expect(
        PairAligner.Align(Xm, Ym, new PairOptions { Pattern = StepPattern.Symmetric2, Window = 3 }),
        5.1243262950138551, 0.23292392250062977,
        [1, 2, 3, 3, 4, 5, 6, 7, 8, 9, 9, 10], [1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12]);

    // Refusals the R package makes ("Open-end alignments require normalizable step patterns",
    // "Open-begin requires step patterns with 'N' normalization", no path for a narrow window).
    [Fact]
    public void Refuses_symmetric1_with_open_end()
    {
        var e = Assert.Throws<ArgumentException>(() => PairAligner.Align(Qe, R, new PairOptions { Pattern = StepPattern.Symmetric1, OpenEnd = true }));
        Assert.Contains("normalisable", e.Message);
    }

    [Fact]
    public void Refuses_symmetric2_with_open_begin()
    {
        var e = Assert.Throws<ArgumentException>(() => PairAligner.Align(Q, R, new PairOptions { Pattern = StepPattern.Symmetric2, OpenBegin = true }));
        Assert.Contains("Open-begin", e.Message);
    }

    [Theory]
    [InlineData("symmetric1")]
    [InlineData("symmetric2")]
    [InlineData("asymmetric")]
    public void Refuses_a_window_narrower_than_the_length_difference(string pattern)
    {
        // |16 - 8| = 8 > 3
        var e = Assert.Throws<ArgumentException>(() => PairAligner.Align(Q, R, new PairOptions { Pattern = StepPattern.Parse(pattern), Window = 3 }));
        Assert.Contains("No warping path", e.Message);
    }
}
