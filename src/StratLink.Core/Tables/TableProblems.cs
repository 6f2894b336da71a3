using StratLink.Checks;

namespace StratLink.Tables;

/// <summary>
/// Reports the problems of one table file, at most <see cref="PerCode"/> of each kind with their
/// lines, then one summary: a broken million-row file must give a readable list, not a million lines.
/// </summary>
internal sealed class TableProblems(FindingList target, string file)
{
    public const int PerCode = 20;

    private readonly Dictionary<string, int> _counts = new(StringComparer.Ordinal);

    public string File => file;
    public bool HasErrors { get; private set; }

    public void Error(string code, string message, int? line = null, string? field = null)
    {
        HasErrors = true;
        int n = _counts.GetValueOrDefault(code) + 1;
        _counts[code] = n;
        if (n <= PerCode) target.AddError(code, message, file, line, field);
    }

    /// <summary>An error that sums up others (never capped).</summary>
    public void Summary(string code, string message, string? field = null)
    {
        HasErrors = true;
        target.AddError(code, message, file, null, field);
    }

    public void Warning(string code, string message, int? line = null, string? field = null) =>
        target.AddWarning(code, message, file, line, field);

    public void Note(string code, string message, int? line = null, string? field = null) =>
        target.AddNote(code, message, file, line, field);

    /// <summary>Adds one summary per kind that had more problems than were listed.</summary>
    public void Flush()
    {
        foreach (var (code, n) in _counts.Where(c => c.Value > PerCode).ToList())
        {
            target.AddError(code, $"{n} problems of this kind in all; the first {PerCode} are listed", file);
            _counts[code] = 0;
        }
    }
}
