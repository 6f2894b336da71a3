using StratLink.Alignment;
using StratLink.Demo;
using StratLink.Model;
using Xunit.Abstractions;

namespace StratLink.Tests.Alignment;

/// <summary>
/// The site scale (every core aligned again to the stack of the others) on generated demo sites,
/// against the generator's hidden truth: per core, dtw must at least halve the straight-line-ties
/// error and the ensemble's 95% band hold the true composite depth at >= 90% of samples (a 95% band
/// with some model misfit), as for alignment to the reference alone. Seeds 5 and 6 were not looked at
/// while the method was worked on.
/// </summary>
public class SiteAlignerTests(ITestOutputHelper output)
{
    [Theory]
    [InlineData(1)]
    [InlineData(2)]
    [InlineData(3)]
    [InlineData(4)]
    [InlineData(5)]
    [InlineData(6)]
    public void Every_core_aligned_to_the_stack_of_the_others_beats_the_ties_baseline(int seed)
    {
        var site = DemoSiteGenerator.Generate(seed);
        var loaded = SiteShapeAlignmentTests.Load(site);
        var project = site.Project with { Alignment = site.Project.Alignment with { Scale = AlignmentScales.Site } };
        var dtw = CoreAligner.Align(loaded.WithProject(project), null, default);
        var ties = CoreAligner.Align(loaded.WithProject(project with { Alignment = project.Alignment with { Method = AlignmentMethods.Ties } }), null, default);
        var failures = new List<string>();
        foreach (var (id, truth) in site.Truth)
        {
            if (id == site.ReferenceCoreId) continue;
            var e = dtw.Mappings[id];
            double sqDtw = 0, sqTies = 0;
            int inside = 0, n = truth.Depths.Length;
            for (int k = 0; k < n; k++)
            {
                double z = truth.Depths[k], t = truth.CompositeDepths[k];
                double ed = e.Median.ToCompositeValue(z) - t, et = ties.Mappings[id].Median.ToCompositeValue(z) - t;
                sqDtw += ed * ed;
                sqTies += et * et;
                var (lo, hi) = e.CompositeRange(z);
                if (t >= lo && t <= hi) inside++;
            }
            double rmsDtw = Math.Sqrt(sqDtw / n), rmsTies = Math.Sqrt(sqTies / n), coverage = (double)inside / n;
            output.WriteLine($"seed {seed} {id}: RMS site {rmsDtw:0.00}, ties {rmsTies:0.00} cm; band {coverage:P1}; {dtw.Diagnostics[id].SiteRounds} rounds");
            if (rmsDtw > 0.5 * rmsTies) failures.Add($"{id}: RMS {rmsDtw:0.00} is more than half the ties RMS {rmsTies:0.00}");
            if (coverage < 0.90) failures.Add($"{id}: the band holds the truth at {coverage:P1}");
            Assert.True(dtw.Diagnostics[id].SiteRounds >= 1, $"{id} was not aligned to the stack");
        }
        foreach (var f in dtw.Findings) output.WriteLine(f.ToString());
        Assert.True(failures.Count == 0, string.Join("; ", failures));
    }
}
