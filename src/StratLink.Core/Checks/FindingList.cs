namespace StratLink.Checks;

/// <summary>Findings collected while reading or checking, so every problem is reported at once.</summary>
public sealed class FindingList : List<Finding>
{
    public bool HasErrors => this.Any(f => f.Severity == Severity.Error);

    public void AddError(string code, string message, string? file = null, int? line = null, string? field = null) =>
        Add(new Finding { Severity = Severity.Error, Code = code, Message = message, File = file, Line = line, Field = field });

    public void AddWarning(string code, string message, string? file = null, int? line = null, string? field = null) =>
        Add(new Finding { Severity = Severity.Warning, Code = code, Message = message, File = file, Line = line, Field = field });

    public void AddNote(string code, string message, string? file = null, int? line = null, string? field = null) =>
        Add(new Finding { Severity = Severity.Note, Code = code, Message = message, File = file, Line = line, Field = field });
}
