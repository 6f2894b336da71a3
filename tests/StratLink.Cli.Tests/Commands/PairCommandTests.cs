using System.Globalization;
using StratLink.Cli;

namespace StratLink.Tests.Commands;

/// <summary>
/// The pair verb end to end: tables written to temporary files, the command run in-process, its
/// printed distance and written path compared with check values (source: a general-purpose reference library) computed with the R package dtw
/// 1.23-2 (Giorgino 2009, J. Stat. Softw. 31(7)) on R 4.2.2 with proxy 0.4-27, cases free of ties so
/// paths match exactly; distances to 1e-12 (printed round-trip, values of order 1-30).
/// </summary>
public sealed class PairCommandTests : IDisposable
{
    private static readonly double[] X = [1.20, 1.90, 3.10, 4.05, 3.60, 2.20, 1.15, 0.70, 1.40, 2.65];
    private static readonly double[] Y = [1.00, 1.35, 2.05, 2.95, 3.85, 4.20, 3.70, 2.55, 1.60, 0.80, 0.95, 1.75, 2.80];
    private static readonly double[] Xs = [4.10, 3.20, 2.00, 1.10, 0.60, 0.80, 1.70, 2.90, 3.60, 3.30, 2.40, 1.50, 1.00, 0.70];
    private static readonly double[] Ys = [0.57, 0.83, 1.76, 3.02, 3.94, 4.07, 3.21, 1.98, 1.13, 0.52, 0.88, 1.66, 2.93, 3.58, 3.31, 2.47];
    private static readonly double[] Q = [3.30, 2.95, 2.05, 1.45, 0.85, 1.35, 2.70, 3.20];
    private static readonly double[] R = [0.30, 0.80, 1.60, 2.70, 3.40, 3.10, 2.20, 1.30, 0.90, 1.50, 2.60, 3.30, 2.90, 1.80, 1.00, 0.60];

    private readonly string _dir = Directory.CreateTempSubdirectory("stratlink-pair-").FullName;

    public void Dispose() => Directory.Delete(_dir, true);

    private static (int Code, string Out, string Err) Run(params string[] args)
    {
        var stdout = new StringWriter();
        var stderr = new StringWriter();
        int code = CliApp.Run(args, stdout, stderr, stderrIsTerminal: false);
        return (code, stdout.ToString(), stderr.ToString());
    }

    /// <summary>A table with a header and one row per sample; depths (if given) are irregular on purpose: only their order matters.</summary>
    private string Table(string name, string header, IEnumerable<string> rows)
    {
        string path = Path.Combine(_dir, name);
        File.WriteAllLines(path, [header, .. rows]);
        return path;
    }

    private string Series(string name, double[] v, bool withDepth) => withDepth
        ? Table(name, "depth,ms", v.Select((x, k) => $"{(10 + k * k * 0.5).ToString("R", CultureInfo.InvariantCulture)},{x.ToString("R", CultureInfo.InvariantCulture)}"))
        : Table(name, "ms", v.Select(x => x.ToString("R", CultureInfo.InvariantCulture)));

    private static double Printed(string output, string label)
    {
        string line = output.Split('\n').Single(l => l.StartsWith(label + " ", StringComparison.Ordinal));
        return double.Parse(line[label.Length..].Trim().Split(' ')[0], CultureInfo.InvariantCulture);
    }

    private static (int[] A, int[] B) ReadPath(string file)
    {
        var lines = File.ReadAllLines(file);
        Assert.Equal("index_a,index_b", lines[0]);
        var rows = lines.Skip(1).Select(l => l.Split(',')).ToArray();
        return (rows.Select(r => int.Parse(r[0], CultureInfo.InvariantCulture)).ToArray(), rows.Select(r => int.Parse(r[1], CultureInfo.InvariantCulture)).ToArray());
    }

    [Fact]
    public void A2_symmetric2_fromTablesWithDepth()
    {
        string a = Series("x.csv", X, withDepth: true), b = Series("y.csv", Y, withDepth: true), path = Path.Combine(_dir, "path.csv");
        var (code, output, err) = Run("pair", a, b, "--path", path);
        Assert.True(code == 0, err);
        // R dtw 1.23-2, case A2: dtw(x, y, step.pattern=symmetric2): distance 4.75, normalised 0.20652173913043476.
        Assert.Equal(4.7499999999999991, Printed(output, "distance"), 1e-12);
        Assert.Equal(0.20652173913043476, Printed(output, "normalised"), 1e-12);
        var (ia, ib) = ReadPath(path);
        Assert.Equal([1, 1, 2, 3, 4, 4, 5, 6, 7, 8, 8, 9, 10], ia);
        Assert.Equal([1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12, 13], ib);
    }

    [Fact]
    public void B2_symmetric2_window3_inFileOrder()
    {
        string a = Series("xs.csv", Xs, withDepth: false), b = Series("ys.csv", Ys, withDepth: false), path = Path.Combine(_dir, "path.csv");
        var (code, output, err) = Run("pair", a, b, "--signals", "ms", "--pattern", "symmetric2", "--window", "3", "--path", path);
        Assert.True(code == 0, err);
        // R dtw 1.23-2, case B2: sakoechiba window 3: distance 29.41, normalised 0.9803333333333335.
        Assert.Equal(29.410000000000004, Printed(output, "distance"), 1e-12);
        Assert.Equal(0.9803333333333335, Printed(output, "normalised"), 1e-12);
        var (ia, ib) = ReadPath(path);
        Assert.Equal([1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12, 13, 13, 14, 14, 14, 14, 14, 14], ia);
        Assert.Equal([1, 1, 1, 2, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 11, 12, 13, 14, 15, 16], ib);
    }

    [Fact]
    public void C3_asymmetric_openBeginAndEnd()
    {
        string a = Series("q.csv", Q, withDepth: true), b = Series("r.csv", R, withDepth: true), path = Path.Combine(_dir, "path.csv");
        var (code, output, err) = Run("pair", a, b, "--pattern", "asymmetric", "--open-begin", "--open-end", "--path", path);
        Assert.True(code == 0, err);
        // R dtw 1.23-2, case C3: distance 0.95, normalised 0.11875, query matched to reference rows 5..12.
        Assert.Equal(0.94999999999999996, Printed(output, "distance"), 1e-12);
        Assert.Equal(0.11874999999999999, Printed(output, "normalised"), 1e-12);
        var (ia, ib) = ReadPath(path);
        Assert.Equal([1, 2, 3, 4, 5, 6, 7, 8], ia);
        Assert.Equal([5, 6, 7, 8, 9, 10, 11, 12], ib);
    }

    [Fact]
    public void D1_twoSignals_symmetric2()
    {
        // R dtw 1.23-2, case D1: two-column series X, Y, Euclidean local cost: distance 5.1243262950138551.
        double[] x1 = [0.00, 0.50, 1.20, 2.00, 2.60, 3.10, 3.30, 3.00, 2.40, 1.50], x2 = [1.00, 1.30, 1.10, 0.60, 0.20, 0.40, 1.00, 1.60, 2.10, 2.30];
        double[] y1 = [0.10, 0.30, 0.90, 1.60, 2.30, 2.80, 3.20, 3.40, 3.20, 2.70, 2.00, 1.40], y2 = [0.90, 1.20, 1.25, 0.90, 0.45, 0.15, 0.50, 0.95, 1.50, 1.95, 2.25, 2.40];
        var inv = CultureInfo.InvariantCulture;
        // Extra column "note" in B only and a column order that differs: signals are matched by name.
        string a = Table("X.csv", "depth,ms,density", x1.Select((v, k) => $"{k},{v.ToString(inv)},{x2[k].ToString(inv)}"));
        string b = Table("Y.csv", "density,depth,ms,age", y1.Select((v, k) => $"{y2[k].ToString(inv)},{k},{v.ToString(inv)},{k * 7}"));
        var (code, output, err) = Run("pair", a, b, "--signals", "ms,density");
        Assert.True(code == 0, err);
        Assert.Equal(5.1243262950138551, Printed(output, "distance"), 1e-12);
        Assert.Equal(0.23292392250062977, Printed(output, "normalised"), 1e-12);
    }

    [Fact]
    public void Symmetric1_printsNoNormalisedDistance()
    {
        string a = Series("x.csv", X, withDepth: true), b = Series("y.csv", Y, withDepth: true);
        var (code, output, _) = Run("pair", a, b, "--pattern", "symmetric1");
        Assert.Equal(ExitCodes.Success, code);
        // R dtw 1.23-2, case A1: symmetric1 distance 2.75, normalised NA.
        Assert.Equal(2.75, Printed(output, "distance"), 1e-12);
        Assert.DoesNotContain("normalised", output);
    }

    [Fact]
    public void MissingFileIsAUsageErrorNamingIt()
    {
        string b = Series("y.csv", Y, withDepth: true);
        string missing = Path.Combine(_dir, "nope.csv");
        var (code, _, err) = Run("pair", missing, b);
        Assert.Equal(ExitCodes.Usage, code);
        Assert.Contains(missing, err);
        Assert.Contains("does not exist", err);
    }

    [Fact]
    public void UnknownSignalNamesTheFileAndColumn()
    {
        string a = Series("x.csv", X, withDepth: true), b = Series("y.csv", Y, withDepth: true);
        var (code, _, err) = Run("pair", a, b, "--signals", "density");
        Assert.Equal(ExitCodes.Usage, code);
        Assert.Contains("x.csv", err);
        Assert.Contains("'density'", err);
    }

    [Fact]
    public void NoDepthColumnAndNoSignalsAsksForThem()
    {
        string a = Series("x.csv", X, withDepth: false), b = Series("y.csv", Y, withDepth: false);
        var (code, _, err) = Run("pair", a, b);
        Assert.Equal(ExitCodes.Usage, code);
        Assert.Contains("x.csv", err);
        Assert.Contains("--signals", err);
    }

    [Theory]
    // R dtw 1.23-2 refuses these combinations as well.
    [InlineData("--pattern", "symmetric1", "--open-end", "normalisable")]
    [InlineData("--pattern", "symmetric2", "--open-begin", "normalised by the query length")]
    public void RefusedPatternAndOpenEnds(string o1, string v1, string o2, string expected)
    {
        string a = Series("x.csv", X, withDepth: true), b = Series("y.csv", Y, withDepth: true);
        var (code, _, err) = Run("pair", a, b, o1, v1, o2);
        Assert.Equal(ExitCodes.Usage, code);
        Assert.Contains(v1, err);
        Assert.Contains(expected, err);
    }

    [Fact]
    public void WindowNarrowerThanTheLengthDifferenceIsRefused()
    {
        // x has 10 rows, y 13: no path within |i - j| <= 2 (R dtw raises an error too).
        string a = Series("x.csv", X, withDepth: true), b = Series("y.csv", Y, withDepth: true);
        var (code, _, err) = Run("pair", a, b, "--window", "2");
        Assert.Equal(ExitCodes.Usage, code);
        Assert.Contains("window of 2", err);
    }

    [Fact]
    public void UnknownPatternNamesTheOption()
    {
        string a = Series("x.csv", X, withDepth: true), b = Series("y.csv", Y, withDepth: true);
        var (code, _, err) = Run("pair", a, b, "--pattern", "diagonal");
        Assert.Equal(ExitCodes.Usage, code);
        Assert.Contains("--pattern", err);
        Assert.Contains("symmetric2", err);
    }
}
