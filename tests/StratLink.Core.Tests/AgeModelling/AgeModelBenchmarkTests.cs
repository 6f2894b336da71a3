using System.Diagnostics;
using StratLink.AgeModelling;
using StratLink.Alignment;
using StratLink.Model;
using static StratLink.Tests.AgeModelling.AgeModelFixture;

namespace StratLink.Tests.AgeModelling;

public class AgeModelBenchmarkTests
{
    /// <summary>
    /// Benchmark-sized run (2,000 iterations; 4 cores of 2,000 samples; alignment ensembles of 200 members with
    /// 100 knots): prints wall and CPU time, asserts only what the run must produce (speed is not asserted).
    /// </summary>
    [Fact]
    public void BenchmarkSizedRunPrintsItsTime()
    {
        string[] ids = ["A", "B", "C", "D"];
        var rng = new Random(1);
        var ages = Enumerable.Range(0, 12).Select(k => (AgeControlSpec)Calendar($"c{k}", ids[k % 4], 20 + 80 * k, 4 * (20 + 80 * k) + 10 * rng.NextDouble(), 30)).ToList();
        var project = Project(ages, ids.ToDictionary(id => id, _ => Range(0, 999.5, 0.5)), iterations: 2000, seed: 42);
        var ensembles = ids.Select(id =>
        {
            var core = Range(0, 1000, 10);
            var members = Enumerable.Range(0, 200).Select(_ =>
            {
                double acc = 0;
                return new DepthMapping(id, Unit, core, core.Select(c => c == 0 ? 0 : acc += 10 * (1 + 0.05 * (rng.NextDouble() - 0.5))).ToArray());
            }).ToList();
            return new MappingEnsemble(members[0], members);
        }).ToArray();

        var cpu0 = Process.GetCurrentProcess().TotalProcessorTime;
        var watch = Stopwatch.StartNew();
        var result = AgeModeller.Run(project, Aligned(ensembles), NoVarves, null, CancellationToken.None);
        watch.Stop();
        double cpu = (Process.GetCurrentProcess().TotalProcessorTime - cpu0).TotalSeconds;
        Console.WriteLine($"age model, 2000 iterations x 4 cores x 2000 samples, ensemble 200: wall {watch.Elapsed.TotalSeconds:0.00} s, CPU {cpu:0.00} s on {Environment.ProcessorCount} cores");

        Assert.Equal(2000, result.MemberCount);
        Assert.All(ids, id => Assert.Equal(2000, result.Cores[id].Count));
        Assert.All(ids, id => Assert.All(result.Cores[id].AgeMedianBP, a => Assert.True(double.IsFinite(a))));
    }
}
