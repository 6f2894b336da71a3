using System.Globalization;
using StratLink.AgeModelling;
using StratLink.Checks;
using StratLink.Model;
using StratLink.Tests.TestSupport;
using StratLink.Workflows;
using Xunit.Abstractions;

namespace StratLink.Tests.Workflows;

/// <summary>
/// Projects that date their core by a dated target, built through the build workflow. First, benthic d18O of ODP
/// Site 849 (Mix et al. 1995, Proc. ODP Sci. Results 138:371-412; the NOAA table as published) dated by the
/// LR04 benthic stack (Lisiecki and Raymo 2005, Paleoceanography 20, PA1003; ages in ka), and the age model's
/// ages of the core's samples compared with the authors' own orbitally tuned age of every sample (the yrBP
/// column of the same table: an independent tuning, so the two differ by a few kyr at best). Second, a dated
/// master core on depth: ODP 925's benthic d18O on composite depth with the authors' age model dating it, and
/// ODP 927 dated by alignment to it (Bickert, Curry and Wefer 1997, Proc. ODP Sci. Results 154:239-254, both
/// sites), compared with the authors' own age model of 927.
/// </summary>
public sealed class DatedTargetBuildTests(ITestOutputHelper output) : IDisposable
{
    private readonly string _dir = Directory.CreateTempSubdirectory("stratlink-target-").FullName;

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    private static string Quoted(string path) => "\"" + path.Replace("\\", "/") + "\"";

    [Fact]
    public void Odp849_dated_by_the_LR04_stack_in_a_project_build_agrees_with_the_published_ages()
    {
        // Replicate analyses share a depth: their mean (age column included, so the published age stays the sample's).
        // The span is the site's first and last tuned ages (3.6 and 4978 ka), rounded outwards to whole ka.
        // LR04's age error: about 4 kyr over the last 1 Myr and 6 kyr before (Lisiecki and Raymo 2005, from memory): 5 kyr throughout.
        string yaml = $"""
            format: stratlink-project/1
            depth_unit: cm
            cores:
              - id: ODP849
                table: {Quoted(RepoPaths.Data("benthic-stack", "ODP849_isot_Mix1995_NOAA.txt"))}
                missing_values: [-999]
                repeated_depths: mean
                columns: {"{"}d18Oforams-b: d18o{"}"}
                signals: [d18o, yrBP]
            alignment:
              window: 0.1
              ensemble: 40
            age_model:
              iterations: 200
              seed: 7
            target:
              table: {Quoted(RepoPaths.Data("benthic-stack", "LR04stack.txt"))}
              header_line: 5
              age_column: Time (ka)
              age_unit: ka
              age_span: [3, 4979]
              signal: d18o
              columns: {"{"}"Benthic d18O (per mil)": d18o{"}"}
              age_error: 5000
            """;
        string file = Path.Combine(_dir, "odp849.stratlink.yaml");
        File.WriteAllText(file, yaml);
        var loaded = ProjectLoader.Load(file);
        Assert.False(loaded.Problems.HasErrors, string.Join("\n", loaded.Problems.Select(f => $"{f.Line} {f.Field}: {f.Message}")));
        Assert.NotNull(loaded.Target);

        var build = BuildWorkflow.Run(loaded, null, CancellationToken.None);
        Assert.True(build.Ages.IsBuilt, string.Join("\n", build.Findings.Select(f => f.Message)));
        var transferred = build.Ages.Controls.Where(c => c.Id.StartsWith(TargetAgeControls.IdPrefix + "ODP849:", StringComparison.Ordinal)).ToList();
        Assert.Equal(DatedTargetSpec.DefaultControlsPerCore + 1, transferred.Count);
        Assert.All(transferred, c => Assert.True(c.Used, $"{c.Id} is not used"));
        Assert.Contains("LR04stack.txt by d18o (ensemble seed 7", build.Methods["target"]);

        var table = loaded.Tables["ODP849"];
        double[] published = table.Signals["yrBP"].Select(a => a / 1000).ToArray(); // kyr
        var ages = build.Ages.Cores["ODP849"];
        double sq = 0;
        int inside = 0, n = 0;
        for (int k = 0; k < ages.Count; k++)
        {
            if (double.IsNaN(published[k])) continue;
            double e = ages.AgeMedianBP[k] / 1000 - published[k];
            sq += e * e;
            if (published[k] >= ages.AgeLoBP[k] / 1000 && published[k] <= ages.AgeHiBP[k] / 1000) inside++;
            n++;
        }
        double rms = Math.Sqrt(sq / n), coverage = (double)inside / n;
        // Constant rate between the span's ends, the age model without the target's shape.
        double[] z = table.Depths;
        double straight = Math.Sqrt(Enumerable.Range(0, z.Length).Where(k => !double.IsNaN(published[k]))
            .Sum(k => Math.Pow(3 + (4979 - 3) * (z[k] - z[0]) / (z[^1] - z[0]) - published[k], 2)) / n);
        double width = Enumerable.Range(0, ages.Count).Average(k => (ages.AgeHiBP[k] - ages.AgeLoBP[k]) / 1000);
        output.WriteLine(string.Create(CultureInfo.InvariantCulture,
            $"ODP 849 dated by LR04 through the build ({transferred.Count} transferred controls): RMS {rms:0.0} kyr against the published ages (constant rate between the span's ends: {straight:0.0} kyr); 95% range holds the published age at {coverage:P1} of {n} samples (mean width {width:0.0} kyr); warnings: {string.Join(", ", build.Findings.Where(f => f.Severity == Severity.Warning).Select(f => f.Code).Distinct())}"));

        // Bounds: the target must at least halve the constant-rate error, and stay within half a 41-kyr obliquity cycle of the authors' tuning, the scale on which a tuning can be
        // off by a cycle (common practice), as the alignment alone; the age model adds the target's age error and
        // the rate's freedom between controls, so its 95 % range must hold the published age at least as often as the
        // transferred controls' own 95 % intervals do at the library level (90 %; the bare alignment band: 67 %).
        Assert.True(rms <= 0.5 * straight, $"RMS {rms:0.0} kyr is not at most half the constant-rate {straight:0.0} kyr");
        Assert.True(rms <= 20.5, $"RMS {rms:0.0} kyr exceeds half an obliquity cycle");
        Assert.True(coverage >= 0.90, $"95% range holds the published age at only {coverage:P1}");
    }

    [Fact]
    public void Odp927_dated_by_ODP925_on_depth_with_its_age_model_agrees_with_927s_published_age_model()
    {
        // Both tables as published: free-text preambles, blank-separated, replicate species at one depth
        // (their mean); the age models are "mcd age" pairs in Ma. 925's model starts at 0.98 mcd, so its top
        // metre is left out (not extrapolated). Its age error: 5 kyr, a typical orbital-tuning uncertainty (common practice).
        string ceara(string f) => Quoted(RepoPaths.Data("ceara-rise", f));
        string yaml = $"""
            format: stratlink-project/1
            depth_unit: m
            cores:
              - id: ODP927
                table: {ceara("ODP927_d18O_Bickert1997.txt")}
                depth_column: mcd
                repeated_depths: mean
                signals: [d18O]
            alignment:
              window: 0.1
              ensemble: 40
            age_model:
              iterations: 200
              seed: 11
            target:
              table: {ceara("ODP925_d18O_Bickert1997.txt")}
              depth_column: mcd
              repeated_depths: mean
              signal: d18O
              age_unit: Ma
              age_model:
                table: {ceara("ODP925_agemodel_Bickert1997.txt")}
                depth_column: mcd
              age_error: 5000
            """;
        string file = Path.Combine(_dir, "odp927.stratlink.yaml");
        File.WriteAllText(file, yaml);
        var loaded = ProjectLoader.Load(file);
        Assert.False(loaded.Problems.HasErrors, string.Join("\n", loaded.Problems.Select(f => $"{f.Line} {f.Field}: {f.Message}")));
        Assert.Contains(loaded.Problems, f => f.Code == StratLink.ProjectIO.ProjectCodes.TableBeyondAgeModel);
        // The target's first dated row: 1.01 mcd, between the model's 0.98 mcd (0.021 Ma) and 1.93 mcd (0.043 Ma).
        Assert.Equal(21_000 + 22_000 * (1.01 - 0.98) / (1.93 - 0.98), loaded.Target!.AgesBP[0], 6);

        var build = BuildWorkflow.Run(loaded, null, CancellationToken.None);
        Assert.True(build.Ages.IsBuilt, string.Join("\n", build.Findings.Select(f => f.Message)));
        Assert.Contains("dated by its age model", build.Methods["target"]);

        // 927's published age model, linear between its rows (a few rows repeat a depth; the first is kept).
        var model = new SortedDictionary<double, double>();
        foreach (string line in File.ReadLines(RepoPaths.Data("ceara-rise", "ODP927_agemodel_Bickert1997.txt")))
        {
            var f = line.Split((char[]?)null, StringSplitOptions.RemoveEmptyEntries);
            if (f.Length >= 2 && double.TryParse(f[0], NumberStyles.Float, CultureInfo.InvariantCulture, out double z) && double.TryParse(f[1], NumberStyles.Float, CultureInfo.InvariantCulture, out double a))
                model.TryAdd(z, a * 1000); // kyr
        }
        double[] mz = [.. model.Keys], ma = [.. model.Values];
        var published = MathNet.Numerics.Interpolation.LinearSpline.InterpolateSorted(mz, ma);
        var table = loaded.Tables["ODP927"];
        var ages = build.Ages.Cores["ODP927"];
        double sq = 0, sqStraight = 0;
        int inside = 0, n = 0;
        double a0 = published.Interpolate(table.Depths[0]), a1 = published.Interpolate(table.Depths[^1]);
        for (int k = 0; k < ages.Count; k++)
        {
            double z = table.Depths[k], truth = published.Interpolate(z);
            double e = ages.AgeMedianBP[k] / 1000 - truth;
            sq += e * e;
            double straight = a0 + (a1 - a0) * (z - table.Depths[0]) / (table.Depths[^1] - table.Depths[0]) - truth;
            sqStraight += straight * straight;
            if (truth >= ages.AgeLoBP[k] / 1000 && truth <= ages.AgeHiBP[k] / 1000) inside++;
            n++;
        }
        double rms = Math.Sqrt(sq / n), rmsStraight = Math.Sqrt(sqStraight / n), coverage = (double)inside / n;
        output.WriteLine(string.Create(CultureInfo.InvariantCulture,
            $"ODP 927 dated by ODP 925 on depth with its age model, through the build: RMS {rms:0.0} kyr against 927's published age model (constant rate between the published end ages: {rmsStraight:0.0} kyr); 95% range holds it at {coverage:P1} of {n} samples"));
        // Bounds as for ODP 849 above: at least half the constant-rate error, within half an obliquity cycle (common practice).
        Assert.True(rms <= 0.5 * rmsStraight, $"RMS {rms:0.0} kyr is not at most half the constant-rate {rmsStraight:0.0} kyr");
        Assert.True(rms <= 20.5, $"RMS {rms:0.0} kyr exceeds half an obliquity cycle");
        // A 95 % range with a margin for 200 members and a published model that is itself uncertain.
        Assert.True(coverage >= 0.90, $"95% range holds 927's published age at only {coverage:P1}");
    }
}
