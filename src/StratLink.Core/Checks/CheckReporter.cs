using System.Globalization;
using StratLink.Model;
using StratLink.Quantities;
using StratLink.Workflows;

namespace StratLink.Checks;

/// <summary>Collects the findings of one check run, pointing each at the project file line the user would edit.</summary>
internal sealed class CheckReporter(LoadedProject loaded)
{
    public List<Finding> Findings { get; } = [];
    public Project Project => loaded.Project;
    public DepthUnit Unit => loaded.Project.DepthUnit;

    /// <param name="source">Source-map path of the key concerned (<c>markers[ash-2].depths.GS-1</c>), for file and line.</param>
    public void Add(Severity severity, string code, string message, string? core, string? item, double? depth, string? source) =>
        Findings.Add(new Finding
        {
            Severity = severity,
            Code = code,
            Message = message,
            Core = core,
            Item = item,
            Depth = depth,
            File = loaded.FilePath,
            Line = source is null ? null : loaded.Document.Lines.LineOf(source),
            Field = source,
        });

    /// <summary>A depth with the project unit, for messages (<c>152.3 cm</c>).</summary>
    public string Depth(double value) => CoreDepth.From(value, Unit).ToString();

    public static string Number(double value, string format = "0.##") => value.ToString(format, CultureInfo.InvariantCulture);

    public static string MarkerSource(string marker, string core) => $"markers[{marker}].depths.{core}";
    public static string AgeSource(string id) => $"ages[{id}]";
}
