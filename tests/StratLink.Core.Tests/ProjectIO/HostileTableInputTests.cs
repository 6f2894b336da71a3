using System.Text;
using FsCheck;
using FsCheck.Fluent;
using StratLink.Checks;
using StratLink.Model;
using StratLink.ProjectIO;
using StratLink.Quantities;
using StratLink.Tables;
using Xunit.Abstractions;
using Xunit.Sdk;

namespace StratLink.Tests.ProjectIO;

/// <summary>
/// The core table reader against random and malformed files (property-based, FsCheck, fixed seeds): it
/// never throws, every problem names the file (and its line, unless it is about the whole file), and it
/// allocates in proportion to the file.
/// </summary>
public sealed class HostileTableInputTests(ITestOutputHelper output) : IDisposable
{
    private readonly string _dir = Directory.CreateTempSubdirectory("stratlink-hostile-table-").FullName;

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    private static readonly string ValidTable = "# core T-1, invented\ndepth,section,ms,density,ca_ti\n"
        + string.Concat(Enumerable.Range(0, 40).Select(i => $"{i * 0.5:0.0},1,{10 + i % 7},{1.3 + i * 0.001:0.000},{0.02 * (i % 5):0.00}\n"));

    private static readonly string[] CsvFragments =
        [",", ";", "\t", "\"", "\"\"", ",,,,", "depth,depth,ms\n", "ms,ms\n", "depth", "section", "\r", "\r\n", "\n\n", "NA", "-999", "#", "\0", "\u00b0", "\xff\xfe"];

    private static readonly CoreSpec Spec = new() { Id = "T-1", Table = "t.csv", Sections = [new SectionSpec("1", CoreDepth.From(0, DepthUnit.Centimetre))] };

    /// <summary>
    /// Allocation allowed per byte of table. The reader streams rows, so long tables cost the numbers kept
    /// (8 bytes a cell, doubled by buffer growth) and line buffers; wide tables cost a column builder each:
    /// measured about 500 bytes a byte of file for a 50,000-column table (Release), constant from 5,000 to
    /// 40,000 columns, i.e. linear. The bound sits above that and still catches any super-linear growth.
    /// </summary>
    private const long BytesPerByte = 1024;

    /// <summary>Problems about the whole file, which have no line to point at.</summary>
    private static readonly HashSet<string> WholeFileCodes =
        [ProjectCodes.TableProblem, ProjectCodes.TableNoHeader, ProjectCodes.MissingFile, ProjectCodes.Unreadable, ProjectCodes.TableEmpty];
    private const long FixedBytes = 16L * 1024 * 1024;

    private void ReadSafely(string path, CoreSpec spec)
    {
        var problems = new FindingList();
        long size = new FileInfo(path).Length;
        long before = GC.GetAllocatedBytesForCurrentThread();
        try
        {
            CoreTableReader.Read(path, spec, DepthUnit.Centimetre, problems);
        }
        catch (Exception e)
        {
            throw new XunitException($"CoreTableReader.Read threw {e}\n--- file ({size} bytes) ---\n{ReaderInvariants.Show(File.ReadAllText(path, Encoding.Latin1))}");
        }
        long allocated = GC.GetAllocatedBytesForCurrentThread() - before;
        if (allocated > FixedBytes + BytesPerByte * size)
            throw new XunitException($"Reading {size} bytes allocated {allocated} bytes.");
        foreach (var f in problems)
        {
            if (f.File != path || string.IsNullOrWhiteSpace(f.Message)) throw new XunitException($"Finding without file or message: {f}");
            if (f.Line is null)
            {
                // Capped lists end in one summary per kind ("... in all"), which has no single line either.
                if (!WholeFileCodes.Contains(f.Code) && !f.Message.Contains(" in all", StringComparison.Ordinal))
                    throw new XunitException($"Finding about one place without a line: {f}");
                WithoutLine.Add(f.Code);
            }
            else if (f.Line < 1) throw new XunitException($"Finding with line {f.Line}: {f}");
        }
    }

    private HashSet<string> WithoutLine { get; } = [];

    [Fact]
    public void MutatedTablesNeverCrashTheReader()
    {
        string path = Path.Combine(_dir, "t.csv");
        int tried = 0;
        Check.One(HostileProjectInputTests.Seeded(31, 1000), Prop.ForAll(Arb.From(HostileInput.Mutated(ValidTable, CsvFragments)), text =>
        {
            tried++;
            File.WriteAllText(path, text, Encoding.Latin1);
            ReadSafely(path, Spec);
            return true;
        }));
        output.WriteLine($"{tried} mutated tables tried; codes reported without a line (whole-file problems): {string.Join(", ", WithoutLine.Order())}");
    }

    [Fact]
    public void RandomBytesNeverCrashTheReader()
    {
        string path = Path.Combine(_dir, "t.csv");
        int tried = 0;
        Check.One(HostileProjectInputTests.Seeded(37, 500), Prop.ForAll(Arb.From(HostileInput.Bytes()), bytes =>
        {
            tried++;
            File.WriteAllBytes(path, [.. "depth,ms\n"u8, .. bytes]);
            ReadSafely(path, Spec with { Sections = [] });
            return true;
        }));
        output.WriteLine($"{tried} random byte tables tried; codes without a line: {string.Join(", ", WithoutLine.Order())}");
    }

    public static TheoryData<string, string> Pathological() => new()
    {
        { "empty", "" },
        { "header only", "depth,ms\n" },
        { "duplicate header", "depth,ms,ms\n0,1,2\n" },
        { "duplicate depth column", "depth,depth\n0,1\n" },
        { "empty columns", "depth,,ms,\n0,,1,\n1,,2,\n" },
        { "huge and odd numbers", "depth,ms\n0,1e309\n1,NaN\n2,Infinity\n3,-Infinity\n4,99999999999999999999999999\n5,1e-400\n1e308,1\n" },
        { "depths not increasing", "depth,ms\n2,1\n1,1\n1,1\n" },
        { "ten megabyte line", "depth,ms\n0," + new string('9', 10_000_000) + "\n" },
        { "ten megabyte header", new string('x', 10_000_000) + "\n0,1\n" },
        { "only delimiters", string.Concat(Enumerable.Repeat(",,,,,,\n", 1000)) },
        { "unterminated quote", "depth,ms\n0,\"1\n1,2\n" },
        { "many columns", "depth," + string.Join(",", Enumerable.Range(0, 50_000).Select(i => $"c{i}")) + "\n0," + string.Join(",", Enumerable.Repeat("1", 50_000)) + "\n" },
        { "binary", "depth,ms\n\0\0\0\u0001,\u00ff\n" },
        { "long table", "depth,a,b,c,d\n" + string.Concat(Enumerable.Range(0, 200_000).Select(i => $"{i},1.5,2.5,3.5,4.5\n")) },
    };

    [Theory]
    [MemberData(nameof(Pathological))]
    public void PathologicalTablesGetAMessageNotACrash(string name, string text)
    {
        string path = Path.Combine(_dir, "t.csv");
        File.WriteAllText(path, text, Encoding.Latin1);
        ReadSafely(path, Spec with { Sections = [] });
        var problems = new FindingList();
        CoreTableReader.Read(path, Spec with { Sections = [] }, DepthUnit.Centimetre, problems);
        output.WriteLine($"{name}: {(problems.Count == 0 ? "no problems" : problems[0].ToString())}");
    }
}
