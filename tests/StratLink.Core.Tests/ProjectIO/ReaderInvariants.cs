using StratLink.Checks;
using StratLink.ProjectIO;
using Xunit.Sdk;

namespace StratLink.Tests.ProjectIO;

/// <summary>What every reader owes hostile input: no exception, every problem with file and line, bounded memory.</summary>
internal static class ReaderInvariants
{
    /// <summary>
    /// Allocation allowed per input character, bytes. Measured (Release, YamlDotNet 18.1): one giant scalar
    /// costs about 20 bytes a char (the text is 2 bytes a char, the scanner's buffer grows by doubling, and
    /// the reader scans twice: an event pass that refuses aliases, then the node pass); 20,000 one-line
    /// cores about 270 (node objects, the source map, the model); 20,000 unknown keys about 450 (a finding
    /// with a did-you-mean hint each). The bound sits above the worst measured case and is constant per
    /// char, so it holds linear growth and catches anything super-linear: the pathological inputs reach a
    /// megabyte, where a quadratic pattern would exceed it many thousand times, and an alias bomb of 9
    /// levels would expand 10^9 times.
    /// </summary>
    public const long BytesPerChar = 512;

    /// <summary>Fixed allowance: parser state, the finding list, type loading on first use.</summary>
    public const long FixedBytes = 16L * 1024 * 1024;

    public static ProjectDocument ParseSafely(string text, string file = "hostile.yaml")
    {
        long before = GC.GetAllocatedBytesForCurrentThread();
        ProjectDocument doc;
        try
        {
            doc = ProjectReader.Parse(text, file);
        }
        catch (Exception e)
        {
            throw new XunitException($"ProjectReader.Parse threw {e}\n--- input ({text.Length} chars) ---\n{Show(text)}");
        }
        long allocated = GC.GetAllocatedBytesForCurrentThread() - before;
        long bound = FixedBytes + BytesPerChar * text.Length;
        if (allocated > bound) throw new XunitException($"Parsing {text.Length} chars allocated {allocated} bytes (bound {bound}).\n{Show(text)}");
        AllLocated(doc.Problems, file, text.Split('\n').Length, text);
        if (!doc.Problems.HasErrors && doc.Project is null) throw new XunitException($"No error and no project.\n{Show(text)}");
        return doc;
    }

    /// <summary>Every problem names the file and a line within it (line 1 for whole-file problems).</summary>
    public static void AllLocated(IEnumerable<Finding> problems, string file, int lineCount, string input)
    {
        foreach (var f in problems)
        {
            if (f.File != file || f.Line is not int line || line < 1 || line > lineCount + 1)
                throw new XunitException($"Finding without file and line in range 1..{lineCount + 1}: {f}\n{Show(input)}");
            if (string.IsNullOrWhiteSpace(f.Message)) throw new XunitException($"Finding without a message: {f.Code}");
        }
    }

    public static string Show(string text) => text.Length > 600 ? text[..600] + $"... ({text.Length} chars)" : text;
}
