using System.Diagnostics;
using System.Globalization;
using System.Text;
using System.Text.Json;
using StratLink.Alignment;
using StratLink.Tests.TestSupport;

namespace StratLink.Tests.Alignment;

/// <summary>
/// Random inputs against a live general-purpose library: Debian's python3-mlpy, whose
/// mlpy.dtw_std(x, y, dist_only=False) is symmetric1 with |a - b| (the same distances as the R
/// package dtw). Distances must agree to 1e-9 relative, and the local costs summed along our own
/// path must give our distance (the path is a real optimal path, not just a number).
/// </summary>
public class MlpyComparisonTests
{
    private const string Script = """
        import sys, json
        try:
            import mlpy
        except ImportError:
            print("NO_MLPY"); sys.exit(0)
        import numpy as np
        out = []
        for case in json.load(sys.stdin):
            x = np.array(case["x"], dtype=float); y = np.array(case["y"], dtype=float)
            d, cost, path = mlpy.dtw_std(x, y, dist_only=False)
            out.append({"d": float(d), "len": int(len(path[0]))})
        print(json.dumps(out))
        """;

    internal static string RunPython(string script, string stdin)
    {
        const string python = "/usr/bin/python3";
        try { RepoPaths.EnsureAptPackages("python3-mlpy"); }
        catch (InvalidOperationException e) { Assert.Fail($"python3-mlpy is not installed and could not be installed here ({e.Message}); .ci/run installs it with 'apt-get install -y python3-mlpy'."); }
        if (!File.Exists(python)) Assert.Fail($"{python} is missing; .ci/run installs python3-mlpy (apt-get install -y python3-mlpy), which brings it.");
        var psi = new ProcessStartInfo(python, ["-c", script])
        {
            RedirectStandardInput = true,
            RedirectStandardOutput = true,
            RedirectStandardError = true,
            UseShellExecute = false,
        };
        using var p = Process.Start(psi)!;
        var err = p.StandardError.ReadToEndAsync();
        p.StandardInput.Write(stdin);
        p.StandardInput.Close();
        string output = p.StandardOutput.ReadToEnd();
        p.WaitForExit();
        if (output.Trim() == "NO_MLPY")
            Assert.Fail("The Python module mlpy is not installed: .ci/run installs it with 'apt-get install -y python3-mlpy' (run this test with /usr/bin/python3 after that).");
        if (p.ExitCode != 0) Assert.Fail($"python3 with mlpy failed ({p.ExitCode}): {err.Result}");
        return output;
    }

    internal static double[] RandomWalk(Random rng, int n)
    {
        var x = new double[n];
        double v = 0;
        for (int i = 0; i < n; i++) { v += rng.NextDouble() - 0.5; x[i] = v; }
        return x;
    }

    [Fact]
    public void Symmetric1_distances_match_mlpy_on_seeded_random_inputs()
    {
        var rng = new Random(20240611);
        var cases = new List<(double[] X, double[] Y)>();
        int[] lengths = [1, 2, 7, 30, 100, 257, 600];
        foreach (int n in lengths)
            foreach (int m in new[] { n, Math.Max(1, n / 2 + 3), n + 17 })
                cases.Add((RandomWalk(rng, n), RandomWalk(rng, m)));
        var sb = new StringBuilder("[");
        for (int c = 0; c < cases.Count; c++)
        {
            if (c > 0) sb.Append(',');
            sb.Append("{\"x\":").Append(Json(cases[c].X)).Append(",\"y\":").Append(Json(cases[c].Y)).Append('}');
        }
        sb.Append(']');
        using var doc = JsonDocument.Parse(RunPython(Script, sb.ToString()));
        var results = doc.RootElement.EnumerateArray().ToArray();
        Assert.Equal(cases.Count, results.Length);
        for (int c = 0; c < cases.Count; c++)
        {
            var (x, y) = cases[c];
            double expected = results[c].GetProperty("d").GetDouble();
            var r = PairAligner.Align(x, y, new PairOptions { Pattern = StepPattern.Symmetric1 });
            Assert.True(Math.Abs(r.Distance - expected) <= 1e-9 * Math.Max(1, Math.Abs(expected)),
                $"case {c} ({x.Length} x {y.Length}): ours {r.Distance:R}, mlpy {expected:R}");
            double along = 0;
            for (int k = 0; k < r.IndexA.Length; k++) along += Math.Abs(x[r.IndexA[k] - 1] - y[r.IndexB[k] - 1]);
            Assert.True(Math.Abs(along - r.Distance) <= 1e-9 * Math.Max(1, r.Distance), $"case {c}: cost along the path {along:R} vs distance {r.Distance:R}");
            Assert.Equal((1, 1), (r.IndexA[0], r.IndexB[0]));
            Assert.Equal((x.Length, y.Length), (r.IndexA[^1], r.IndexB[^1]));
        }
    }

    internal static string Json(double[] v) =>
        "[" + string.Join(",", v.Select(d => d.ToString("R", CultureInfo.InvariantCulture))) + "]";
}
