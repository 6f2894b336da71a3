using System.Collections.Immutable;
using System.Diagnostics;
using StratLink.Model;
using StratLink.ProjectIO;
using StratLink.Quantities;
using StratLink.Tests.TestSupport;
using Xunit.Abstractions;

namespace StratLink.Tests.ProjectIO;

/// <summary>
/// A save interrupted at any moment leaves the old or the new file complete: a child process saves two
/// versions alternately and is killed (SIGKILL, no chance to clean up) at seeded random moments.
/// </summary>
public sealed class NoLostWorkTests(ITestOutputHelper output)
{
    private const int Kills = 20;

    [Fact]
    public void KilledSaveLeavesOneCompleteVersionAndAReadableBackup()
    {
        string dir = Directory.CreateTempSubdirectory("stratlink-save-").FullName;
        try
        {
            string a = Path.Combine(dir, "version-a.yaml"), b = Path.Combine(dir, "version-b.yaml");
            string target = Path.Combine(dir, "site.yaml");
            // Very different sizes, so a file cut short or mixed from both cannot pass for either.
            ProjectWriter.Save(Version(markers: 2, name: "Version A"), a);
            ProjectWriter.Save(Version(markers: 400, name: "Version B"), b);
            string textA = File.ReadAllText(a), textB = File.ReadAllText(b);
            string dll = SaveStressDll();

            var rng = new Random(20250611);
            int sawA = 0, sawB = 0;
            for (int k = 0; k < Kills; k++)
            {
                using var child = Process.Start(new ProcessStartInfo("dotnet", [dll, a, b, target])
                {
                    RedirectStandardOutput = true,
                    RedirectStandardError = true,
                    UseShellExecute = false,
                })!;
                string? first = child.StandardOutput.ReadLine();
                // Read the child's errors only when it failed: reading them from a live child would block.
                if (first != "saving") Assert.Fail($"the save-stress program did not start: {child.StandardError.ReadToEnd()}");
                Thread.Sleep(rng.Next(0, 150));
                child.Kill(entireProcessTree: true);
                child.WaitForExit();

                string text = File.ReadAllText(target);
                var doc = ProjectReader.Load(target);
                Assert.False(doc.Problems.HasErrors, $"kill {k}: {string.Join("; ", doc.Problems)}");
                Assert.True(text == textA || text == textB, $"kill {k}: the saved file is neither version ({text.Length} chars)");
                if (text == textA) sawA++; else sawB++;

                string backup = target + ".bak";
                if (File.Exists(backup))
                {
                    string bak = File.ReadAllText(backup);
                    Assert.False(ProjectReader.Load(backup).Problems.HasErrors, $"kill {k}: the backup does not parse");
                    Assert.True(bak == textA || bak == textB, $"kill {k}: the backup is neither version ({bak.Length} chars)");
                }
            }
            int leftovers = Directory.GetFiles(dir, ".*.tmp*").Length;
            output.WriteLine($"{Kills} kills: target held version A {sawA} times, version B {sawB} times; {leftovers} temporary files left by killed saves.");

            // The next complete save cleans up what the killed ones left (their processes are gone).
            ProjectWriter.Save(ProjectReader.Load(target).Project!, target);
            Assert.Empty(Directory.GetFiles(dir, ".*.tmp*"));
        }
        finally
        {
            Directory.Delete(dir, recursive: true);
        }
    }

    /// <summary>
    /// The built save-stress program: same configuration and framework folders as this test assembly,
    /// under tests/StratLink.SaveStress (the test project builds it first without referencing it).
    /// </summary>
    private static string SaveStressDll()
    {
        string testDir = Path.TrimEndingDirectorySeparator(AppContext.BaseDirectory);
        string framework = Path.GetFileName(testDir);
        string configuration = Path.GetFileName(Path.GetDirectoryName(testDir)!);
        string dll = Path.Combine(RepoPaths.Root, "tests", "StratLink.SaveStress", "bin", configuration, framework, "StratLink.SaveStress.dll");
        if (!File.Exists(dll)) throw new FileNotFoundException($"The save-stress program is not built at {dll}.", dll);
        return dll;
    }

    private static Project Version(int markers, string name)
    {
        var unit = DepthUnit.Centimetre;
        var cores = ImmutableList.Create(
            new CoreSpec { Id = "K-1", Table = "cores/K-1.csv" },
            new CoreSpec { Id = "K-2", Table = "cores/K-2.csv", Gaps = [DepthInterval.FromTopBottom(50, 52.5, unit)] });
        var list = Enumerable.Range(0, markers).Select(i => new MarkerSpec
        {
            Id = $"layer-{i}",
            Kind = MarkerKind.Tephra,
            Depths = [new MarkerDepth("K-1", CoreDepth.From(1 + i * 0.5, unit)), new MarkerDepth("K-2", CoreDepth.From(1.2 + i * 0.45, unit))],
            Uncertainty = 0.25,
        }).ToImmutableList();
        return new Project { Site = new SiteInfo(name), DepthUnit = unit, Cores = cores, Markers = list };
    }
}
