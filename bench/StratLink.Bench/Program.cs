using System.Collections.Immutable;
using System.Diagnostics;
using System.Globalization;
using StratLink.Alignment;
using StratLink.Checks;
using StratLink.Model;
using StratLink.ProjectIO;
using StratLink.Quantities;
using StratLink.Tables;
using StratLink.Workflows;

namespace StratLink.Bench;

/// <summary>
/// Alignment benchmarks (not tests): symmetric1 DTW with full path against mlpy.dtw_std on the same
/// seeded random walks, and a two-core alignment with ties and a 200-path ensemble.
/// Usage: StratLink.Bench [pair [N ...]] [cores] [kernel N SEED] [ages] (ages: see <see cref="AgeModelBench"/>)
/// </summary>
public static class Program
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    public static int Main(string[] args)
    {
        CultureInfo.CurrentCulture = Inv;
        var what = args.Length == 0 ? ["pair", "cores"] : args;
        if (what.Contains("pair"))
        {
            var sizes = what.SkipWhile(a => a != "pair").Skip(1).TakeWhile(a => int.TryParse(a, out _)).Select(int.Parse).ToArray();
            Pair(sizes.Length > 0 ? sizes : [2000, 5000, 10000]);
        }
        if (what.Contains("cores")) Cores();
        if (what.Contains("kernel"))
        {
            var rest = what.SkipWhile(a => a != "kernel").Skip(1).Select(int.Parse).ToArray();
            Kernel(rest.Length > 0 ? rest[0] : 10000, rest.Length > 1 ? rest[1] : 1);
        }
        if (what.Contains("ages")) AgeModelBench.Run();
        return 0;
    }

    private static double[] RandomWalk(Random rng, int n)
    {
        var x = new double[n];
        double v = 0;
        for (int i = 0; i < n; i++) { v += rng.NextDouble() - 0.5; x[i] = v; }
        return x;
    }

    private static void Pair(int[] sizes)
    {
        string dir = Directory.CreateTempSubdirectory("stratlink-bench-").FullName;
        Console.WriteLine("symmetric1, |a-b|, full path; same seeded random walks for both; best of 3, process CPU seconds");
        Console.WriteLine("(1st: our first call of that size, before the pooled path table's pages are mapped)");
        Console.WriteLine("     N   ours s  ns/cell  1st ns/cell  alloc B/cell   mlpy s  ns/cell   mlpy/ours  |d diff|/d");
        // Warm up until tiered compilation has settled (call counting starts ~100 ms after start-up and
        // promotes methods after 30 calls on a background thread, whose CPU time would count below).
        var warm = new Random(99);
        var (wx, wy) = (RandomWalk(warm, 500), RandomWalk(warm, 500));
        var warmUntil = Stopwatch.StartNew();
        while (warmUntil.ElapsedMilliseconds < 600) PairAligner.Align(wx, wy, new PairOptions { Pattern = StepPattern.Symmetric1 });
        Thread.Sleep(300);
        foreach (int n in sizes)
        {
            var rng = new Random(1 + n);
            var x = RandomWalk(rng, n);
            var y = RandomWalk(rng, n);
            string fx = Path.Combine(dir, $"x{n}.txt"), fy = Path.Combine(dir, $"y{n}.txt");
            File.WriteAllLines(fx, x.Select(v => v.ToString("R", Inv)));
            File.WriteAllLines(fy, y.Select(v => v.ToString("R", Inv)));
            double best = double.MaxValue, first = 0;
            PairResult? r = null;
            long allocated = 0;
            for (int rep = 0; rep < 3; rep++)
            {
                GC.Collect();
                long before = GC.GetTotalAllocatedBytes(true);
                // Process CPU time, not wall time: the machine may be shared, and both sides are timed alike.
                var cpu = Process.GetCurrentProcess().TotalProcessorTime;
                r = PairAligner.Align(x, y, new PairOptions { Pattern = StepPattern.Symmetric1 });
                double used = (Process.GetCurrentProcess().TotalProcessorTime - cpu).TotalSeconds;
                allocated = GC.GetTotalAllocatedBytes(true) - before;
                best = Math.Min(best, used);
                if (rep == 0) first = used;
            }
            double cells = (double)n * n;
            var (mlpyDistance, mlpySeconds) = Mlpy(fx, fy);
            Console.WriteLine($"{n,6} {best,8:0.000} {best * 1e9 / cells,8:0.00} {first * 1e9 / cells,12:0.00} {allocated / cells,13:0.00} {mlpySeconds,8:0.000} {mlpySeconds * 1e9 / cells,8:0.00} {mlpySeconds / best,11:0.0} {Math.Abs(r!.Distance - mlpyDistance) / mlpyDistance,11:0.0e+0}");
            if (Math.Abs(r.Distance - mlpyDistance) > 1e-9 * mlpyDistance) Console.WriteLine($"  DISTANCES DIFFER: ours {r.Distance:R}, mlpy {mlpyDistance:R}");
        }
        Directory.Delete(dir, true);
    }

    /// <summary>
    /// The in-process kernel alone, for bench/whole-process.sh to set beside the C rolling-row loop:
    /// symmetric1 with the full path on random walks of n samples; prints the distance and ns per
    /// cell (best of 3 after a warm-up, process CPU time).
    /// </summary>
    private static void Kernel(int n, int seed)
    {
        var rng = new Random(seed);
        var (x, y) = (RandomWalk(rng, n), RandomWalk(rng, n));
        var options = new PairOptions { Pattern = StepPattern.Symmetric1 };
        var warmUntil = Stopwatch.StartNew();
        while (warmUntil.ElapsedMilliseconds < 600) PairAligner.Align(x.AsSpan(0, 500).ToArray(), y.AsSpan(0, 500).ToArray(), options);
        Thread.Sleep(300);
        double best = double.MaxValue, distance = 0;
        for (int rep = 0; rep < 3; rep++)
        {
            var cpu = Process.GetCurrentProcess().TotalProcessorTime;
            distance = PairAligner.Align(x, y, options).Distance;
            best = Math.Min(best, (Process.GetCurrentProcess().TotalProcessorTime - cpu).TotalSeconds);
        }
        Console.WriteLine($"{distance:R} {best * 1e9 / ((double)n * n):0.000}");
    }

    /// <summary>Best of three CPU timings of mlpy.dtw_std(x, y, dist_only=False) in /usr/bin/python3.</summary>
    private static (double Distance, double Seconds) Mlpy(string fx, string fy)
    {
        const string script = """
            import sys, time, numpy as np, mlpy
            x = np.loadtxt(sys.argv[1]); y = np.loadtxt(sys.argv[2])
            best = 1e30
            for _ in range(3):
                t = time.process_time(); d, c, p = mlpy.dtw_std(x, y, dist_only=False); best = min(best, time.process_time() - t)
                del c, p
            print(repr(float(d)), best)
            """;
        var psi = new ProcessStartInfo("/usr/bin/python3", ["-c", script, fx, fy]) { RedirectStandardOutput = true, RedirectStandardError = true };
        using var p = Process.Start(psi)!;
        string err = p.StandardError.ReadToEndAsync().Result;
        string output = p.StandardOutput.ReadToEnd();
        p.WaitForExit();
        if (p.ExitCode != 0) throw new InvalidOperationException("mlpy run failed (apt-get install -y python3-mlpy): " + err);
        var f = output.Trim().Split(' ');
        return (double.Parse(f[0], Inv), double.Parse(f[1], Inv));
    }

    /// <summary>Two cores of 20,000 samples, three signals, 10% band, 8 ties, open end (the core ends above the reference's bottom), optimal path and 200 sampled paths.</summary>
    private static void Cores()
    {
        const int n = 20000;
        var rng = new Random(5);
        double F(double z) => 0.9 * z + 400 * Math.Sin(2 * Math.PI * z / 7000) + 50;
        var signals = new Func<double, double>[3];
        for (int s = 0; s < 3; s++)
        {
            int bumps = 1500;
            var c = Enumerable.Range(0, bumps).Select(_ => rng.NextDouble() * 21000).ToArray();
            var w = Enumerable.Range(0, bumps).Select(_ => 5 + rng.NextDouble() * 20).ToArray();
            var h = Enumerable.Range(0, bumps).Select(_ => rng.NextDouble() * 2 - 1).ToArray();
            signals[s] = z =>
            {
                double v = 0;
                int k0 = 0;
                for (int b = k0; b < bumps; b++) { double u = (z - c[b]) / w[b]; if (u * u < 50) v += h[b] * Math.Exp(-0.5 * u * u); }
                return v;
            };
        }
        var refDepths = Enumerable.Range(0, n).Select(i => (double)i).ToArray();
        var coreDepths = Enumerable.Range(0, n).Select(i => (double)i).ToArray();
        var names = new[] { "ms", "density", "ca_ti" };
        var refCols = new Dictionary<string, double[]>();
        var coreCols = new Dictionary<string, double[]>();
        for (int s = 0; s < 3; s++)
        {
            refCols[names[s]] = refDepths.Select(z => signals[s](z) + 0.1 * (rng.NextDouble() - 0.5)).ToArray();
            coreCols[names[s]] = coreDepths.Select(z => signals[s](F(z)) + 0.1 * (rng.NextDouble() - 0.5)).ToArray();
        }
        var markers = ImmutableList.CreateBuilder<MarkerSpec>();
        for (int k = 1; k <= 8; k++)
        {
            double z = n * k / 9.0;
            if (F(z) >= n) continue;
            markers.Add(new MarkerSpec { Id = $"m{k}", Depths = [new MarkerDepth("REF", CoreDepth.From(Math.Round(F(z)), DepthUnit.Millimetre)), new MarkerDepth("CORE", CoreDepth.From(Math.Round(z), DepthUnit.Millimetre))] });
        }
        var project = new Project
        {
            DepthUnit = DepthUnit.Millimetre,
            Cores = [new CoreSpec { Id = "REF", Table = "r" }, new CoreSpec { Id = "CORE", Table = "c" }],
            Markers = markers.ToImmutable(),
            Alignment = new AlignmentSettings { Reference = "REF", Window = 0.10, Ensemble = 200, OpenEnd = true },
        };
        var tables = new Dictionary<string, CoreTable>
        {
            ["REF"] = new CoreTable("REF", DepthUnit.Millimetre, refDepths, refCols),
            ["CORE"] = new CoreTable("CORE", DepthUnit.Millimetre, coreDepths, coreCols),
        };
        var loaded = new LoadedProject(new ProjectDocument("bench.yaml", project, new FindingList(), new SourceMap("bench.yaml")), project, tables, new FindingList());
        for (int rep = 0; rep < 2; rep++)
        {
            GC.Collect();
            long before = GC.GetTotalAllocatedBytes(true);
            var sw = Stopwatch.StartNew();
            var cpu = Process.GetCurrentProcess().TotalProcessorTime;
            var result = CoreAligner.Align(loaded, null, default);
            sw.Stop();
            double used = (Process.GetCurrentProcess().TotalProcessorTime - cpu).TotalSeconds;
            var d = result.Diagnostics["CORE"];
            double rms = Math.Sqrt(coreDepths.Where(z => F(z) < n).Average(z => Math.Pow(result.Mappings["CORE"].Median.ToCompositeValue(z) - F(z), 2)));
            Console.WriteLine($"cores: {n} x {n} samples, 3 signals, 10% band, {markers.Count} ties, {result.Mappings["CORE"].Members.Count} paths: {sw.Elapsed.TotalSeconds:0.00} s wall, {used:0.00} s CPU on {Environment.ProcessorCount} cores; " +
                $"{d.Segments} segments, {d.BandCells / 1e6:0.0} M band cells, allocated {(GC.GetTotalAllocatedBytes(true) - before) / 1e6:0} MB, RMS vs truth {rms:0.0} samples");
        }
    }
}
