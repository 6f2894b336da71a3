using System.Globalization;
using System.Text;

namespace StratLink.Checks;

/// <summary>
/// One problem or observation about a project: a stable code, where it is (file and line for input
/// problems; core, item and depth for scientific checks), and a sentence a scientist understands.
/// </summary>
public sealed record Finding
{
    public required Severity Severity { get; init; }

    /// <summary>Stable machine-readable code, e.g. <c>project.unknown-key</c> or <c>tie.crossing</c>.</summary>
    public required string Code { get; init; }

    public required string Message { get; init; }
    public string? Core { get; init; }

    /// <summary>Marker, age control or key the finding is about.</summary>
    public string? Item { get; init; }

    /// <summary>Depth in the project unit, where the finding has one.</summary>
    public double? Depth { get; init; }

    public string? File { get; init; }

    /// <summary>1-based line in <see cref="File"/>.</summary>
    public int? Line { get; init; }

    /// <summary>The key or column the problem is in.</summary>
    public string? Field { get; init; }

    public static Finding Error(string code, string message) => new() { Severity = Severity.Error, Code = code, Message = message };
    public static Finding Warning(string code, string message) => new() { Severity = Severity.Warning, Code = code, Message = message };
    public static Finding Note(string code, string message) => new() { Severity = Severity.Note, Code = code, Message = message };

    /// <summary>"file:line: field: message" form for terminals and logs.</summary>
    public override string ToString()
    {
        var sb = new StringBuilder();
        if (File is not null)
        {
            sb.Append(File);
            if (Line is not null) sb.Append(':').Append(Line.Value.ToString(CultureInfo.InvariantCulture));
            sb.Append(": ");
        }
        sb.Append(Severity.ToString().ToLowerInvariant()).Append(' ').Append(Code).Append(": ");
        if (Field is not null) sb.Append('\'').Append(Field).Append("': ");
        sb.Append(Message);
        return sb.ToString();
    }
}
