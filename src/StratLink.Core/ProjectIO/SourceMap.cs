namespace StratLink.ProjectIO;

/// <summary>
/// Line numbers of the project file's keys and items, by path (<c>cores[GS-1].gaps[0]</c>,
/// <c>markers[ash-2].depths.GS-1</c>), so later checks can point at the line the user must edit.
/// </summary>
public sealed class SourceMap
{
    private readonly Dictionary<string, int> _lines = new(StringComparer.Ordinal);

    public SourceMap(string file) => File = file;

    public string File { get; }

    internal void Set(string path, int line) => _lines.TryAdd(path, line);

    /// <summary>Line of <paramref name="path"/>, else of its nearest recorded parent, else null.</summary>
    public int? LineOf(string path)
    {
        for (string? p = path; !string.IsNullOrEmpty(p); p = Parent(p))
            if (_lines.TryGetValue(p, out int line)) return line;
        return null;
    }

    private static string? Parent(string path)
    {
        int cut = Math.Max(path.LastIndexOf('.'), path.LastIndexOf('['));
        return cut <= 0 ? null : path[..cut];
    }
}
