using FsCheck;
using FsCheck.Fluent;
using Microsoft.FSharp.Core;
using StratLink.ProjectIO;
using Xunit.Abstractions;

namespace StratLink.Tests.ProjectIO;

/// <summary>
/// The project file reader against random and malformed input (property-based, FsCheck, fixed seeds):
/// it never throws, names file and line for every problem, and allocates in proportion to the input.
/// </summary>
public sealed class HostileProjectInputTests(ITestOutputHelper output)
{
    /// <summary>The example of the format spec, every section present.</summary>
    // The full specification-shaped project of the reader tests, plus the checks section.
    internal const string ValidProject = ProjectFiles.Full + "\nchecks:\n  rate_jump_factor: 4\n  tie_misfit_sigmas: 3";

    private static readonly string[] KeyFragments = ["format: ", "cores:\n", "markers:\n", "depths: ", "id: ", "kind: ", "ages:\n", "gaps:\n  - ", "depth_unit: mm\n"];

    internal static Config Seeded(ulong seed, int cases) => Config.QuickThrowOnFailure
        .WithMaxTest(cases)
        .WithReplay(FSharpOption<Replay>.Some(new Replay(new Rnd(seed, 0x9E3779B97F4A7C15UL), FSharpOption<int>.None)));

    [Fact]
    public void ValidProjectParsesCleanly()
    {
        var doc = ReaderInvariants.ParseSafely(ValidProject);
        Assert.False(doc.Problems.HasErrors, string.Join("\n", doc.Problems));
    }

    [Fact]
    public void MutatedProjectFilesNeverCrashTheReader()
    {
        int tried = 0, rejected = 0;
        Check.One(Seeded(20250611, 1500), Prop.ForAll(Arb.From(HostileInput.Mutated(ValidProject, KeyFragments)), text =>
        {
            tried++;
            if (ReaderInvariants.ParseSafely(text).Problems.HasErrors) rejected++;
            return true;
        }));
        output.WriteLine($"{tried} mutated project files tried, {rejected} rejected with errors, none crashed the reader.");
        Assert.True(rejected > tried / 4, "the mutations should break most files; the generator is broken otherwise");
    }

    [Fact]
    public void RandomTextNeverCrashesTheReader()
    {
        int tried = 0;
        Check.One(Seeded(7, 1500), Prop.ForAll(Arb.From(HostileInput.Junk()), text =>
        {
            tried++;
            ReaderInvariants.ParseSafely(text);
            return true;
        }));
        output.WriteLine($"{tried} random texts tried.");
    }

    [Fact]
    public void RandomBytesInAFileNeverCrashTheReader()
    {
        string dir = Directory.CreateTempSubdirectory("stratlink-hostile-").FullName;
        try
        {
            string file = Path.Combine(dir, "site.yaml");
            int tried = 0;
            Check.One(Seeded(11, 300), Prop.ForAll(Arb.From(HostileInput.Bytes()), bytes =>
            {
                tried++;
                File.WriteAllBytes(file, bytes);
                ProjectDocument doc;
                try { doc = ProjectReader.Load(file); }
                catch (Exception e) { throw new Xunit.Sdk.XunitException($"Load threw {e.GetType().Name}: {e.Message}"); }
                ReaderInvariants.AllLocated(doc.Problems, file, int.MaxValue - 1, $"{bytes.Length} bytes");
                return true;
            }));
            output.WriteLine($"{tried} random byte files tried.");
        }
        finally
        {
            Directory.Delete(dir, recursive: true);
        }
    }

    public static TheoryData<string, string> Pathological() => new()
    {
        { "empty", "" },
        { "bom only", "\ufeff" },
        { "comment only", "# nothing\n" },
        { "null root", "~\n" },
        { "list root", "- a\n- b\n" },
        { "number root", "42" },
        { "two documents", "format: stratlink-project/1\n---\nformat: stratlink-project/1\n" },
        { "duplicate key", "format: stratlink-project/1\nformat: stratlink-project/1\ndepth_unit: cm\ncores: []\n" },
        { "duplicate core key", "format: stratlink-project/1\ndepth_unit: cm\ncores:\n  - id: A\n    id: B\n    table: a.csv\n" },
        { "billion laughs", BillionLaughs() },
        { "recursive alias", "format: &a [*a]\n" },
        { "merge key", "base: &b {id: A, table: a.csv}\ncores:\n  - <<: *b\n" },
        { "deep flow nesting", new string('[', 100_000) + new string(']', 100_000) },
        { "deep block nesting", string.Concat(Enumerable.Range(0, 2000).Select(i => new string(' ', i) + "k:\n")) },
        { "deep list nesting", string.Concat(Enumerable.Repeat("- ", 20_000)) + "x\n" },
        { "huge numbers", ValidProject.Replace("152.3", "1e309").Replace("0.15", "NaN").Replace("2000", "99999999999999999999") },
        { "infinities", ValidProject.Replace("152.3", ".inf").Replace("141.0", "-.inf").Replace("0.5\n", "Infinity\n") },
        { "python tag", "format: !!python/object/apply:os.system [\"echo\"]\n" },
        { "binary", "format: stratlink-project/1\ndepth_unit: cm\ncores: \0\u0001\u0002\uffff\n" },
        { "unpaired surrogate", "format: stratlink-project/1\nsite:\n  name: \ud800\n" },
        { "carriage return in a flow mapping", "a: {\rb: 1}" },
        { "tabs for indentation", "format: stratlink-project/1\ncores:\n\t- id: A\n" },
        { "long key", new string('k', 1_000_000) + ": 1\n" },
        { "many keys", string.Concat(Enumerable.Range(0, 20_000).Select(i => $"key{i}: {i}\n")) },
        { "many cores", "format: stratlink-project/1\ndepth_unit: cm\ncores:\n" + string.Concat(Enumerable.Range(0, 10_000).Select(i => $"  - {{id: C{i}, table: c.csv}}\n")) },
    };

    [Theory]
    [MemberData(nameof(Pathological))]
    public void PathologicalFilesGetAMessageNotACrash(string name, string text)
    {
        var doc = ReaderInvariants.ParseSafely(text);
        output.WriteLine($"{name}: {(doc.Problems.Count == 0 ? "no problems" : doc.Problems[0].ToString())}");
    }

    [Fact]
    public void TenMegabyteLineIsReadInBoundedMemory()
    {
        string text = "format: stratlink-project/1\ndepth_unit: cm\ncores: []\nsite:\n  name: " + new string('x', 10_000_000) + "\n";
        long before = GC.GetAllocatedBytesForCurrentThread();
        var doc = ReaderInvariants.ParseSafely(text);
        output.WriteLine($"10 MB line: {GC.GetAllocatedBytesForCurrentThread() - before} bytes allocated; {doc.Problems.Count} problems");
    }

    [Fact]
    public void OversizedFileIsRefusedBeforeReading()
    {
        string dir = Directory.CreateTempSubdirectory("stratlink-hostile-").FullName;
        try
        {
            string file = Path.Combine(dir, "big.yaml");
            using (var fs = File.Create(file)) fs.SetLength(ProjectReader.MaxFileBytes + 1);
            long before = GC.GetAllocatedBytesForCurrentThread();
            var doc = ProjectReader.Load(file);
            Assert.True(GC.GetAllocatedBytesForCurrentThread() - before < 1_000_000, "the file was read although it is too big");
            var f = Assert.Single(doc.Problems);
            Assert.Equal((ProjectCodes.Unreadable, file), (f.Code, f.File));
        }
        finally
        {
            Directory.Delete(dir, recursive: true);
        }
    }

    /// <summary>Nine levels of ten aliases each: 10^9 strings if expanded.</summary>
    private static string BillionLaughs()
    {
        var sb = new System.Text.StringBuilder("a0: &a0 \"lol\"\n");
        for (int i = 1; i <= 9; i++)
            sb.Append($"a{i}: &a{i} [{string.Join(", ", Enumerable.Repeat($"*a{i - 1}", 10))}]\n");
        return sb.ToString();
    }
}
