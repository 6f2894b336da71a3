using System.Diagnostics;
using System.Globalization;
using StratLink.AgeModelling;
using StratLink.Alignment;
using StratLink.Checks;
using StratLink.Demo;
using StratLink.Model;
using StratLink.ProjectIO;
using StratLink.Workflows;

namespace StratLink.Bench;

/// <summary>
/// The age model of the demo site (4 cores, 2,000 iterations, two varve counts, event layers in every core,
/// coring year and three tephra ages): wall and CPU time, against peers in the same session: the same
/// project without its event layers, and with the calendar ages alone (no varve counts). Also the memory the
/// last run allocated, the garbage collections it caused (generations 0/1/2) and their pauses.
/// </summary>
internal static class AgeModelBench
{
    public static void Run()
    {
        var site = DemoSiteGenerator.Generate(1);
        var full = site.Project;
        var alignment = CoreAligner.Align(Load(site, full), null, CancellationToken.None);
        var noEvents = full with { Cores = [.. full.Cores.Select(c => c with { Events = [] })] };
        var calendarOnly = full with { Ages = [.. full.Ages.Where(a => a is CalendarAgeControl)] };
        Console.WriteLine($"age model, {full.Cores.Count} cores x {full.AgeModel.Iterations} iterations, best of 3 (after one warm-up run)");
        Console.WriteLine("case                              wall s   cpu s   wall / full   alloc MB   GCs 0/1/2   GC pause s");
        double reference = 0;
        foreach (var (name, project) in new[] { ("varves + events (full)", full), ("varves, no events", noEvents), ("calendar ages only", calendarOnly) })
        {
            var loaded = Load(site, project);
            var varves = project.Ages.OfType<VarveCountControl>().ToDictionary(c => c.Id,
                c => (site.CountedVarvesOf(c.Core).Select(v => v.Top).ToArray(), site.CountedVarvesOf(c.Core).Select(v => v.Bottom).ToArray()));
            AgeModeller.Run(loaded, alignment, varves, null, CancellationToken.None);
            double bestWall = double.PositiveInfinity, bestCpu = double.PositiveInfinity, allocated = 0, pause = 0;
            var collections = new int[3];
            for (int k = 0; k < 3; k++)
            {
                var cpu = Process.GetCurrentProcess().TotalProcessorTime;
                long bytes = GC.GetTotalAllocatedBytes(true);
                var paused = GC.GetTotalPauseDuration();
                int[] before = [GC.CollectionCount(0), GC.CollectionCount(1), GC.CollectionCount(2)];
                var wall = Stopwatch.StartNew();
                AgeModeller.Run(loaded, alignment, varves, null, CancellationToken.None);
                bestWall = Math.Min(bestWall, wall.Elapsed.TotalSeconds);
                bestCpu = Math.Min(bestCpu, (Process.GetCurrentProcess().TotalProcessorTime - cpu).TotalSeconds);
                allocated = (GC.GetTotalAllocatedBytes(true) - bytes) / 1048576.0;
                pause = (GC.GetTotalPauseDuration() - paused).TotalSeconds;
                for (int g = 0; g < 3; g++) collections[g] = GC.CollectionCount(g) - before[g];
            }
            if (reference == 0) reference = bestWall;
            Console.WriteLine(string.Create(CultureInfo.InvariantCulture,
                $"{name,-32} {bestWall,7:0.000} {bestCpu,7:0.000} {bestWall / reference,12:0.00} {allocated,10:0} {$"{collections[0]}/{collections[1]}/{collections[2]}",11} {pause,12:0.000}"));
        }
    }

    private static LoadedProject Load(DemoSite site, Project project)
    {
        string file = Path.Combine(Path.GetTempPath(), "stratlink-bench-ages", site.ProjectFileName);
        return new LoadedProject(new ProjectDocument(file, project, new FindingList(), new SourceMap(file)), project, site.Tables, new FindingList());
    }
}
