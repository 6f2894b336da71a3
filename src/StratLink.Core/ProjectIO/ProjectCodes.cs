namespace StratLink.ProjectIO;

/// <summary>Stable codes of problems found while reading a project file or its tables.</summary>
public static class ProjectCodes
{
    public const string Unreadable = "project.unreadable";
    public const string Syntax = "project.syntax";
    public const string UnknownKey = "project.unknown-key";
    public const string MissingKey = "project.missing-key";
    public const string InvalidValue = "project.invalid-value";
    public const string UnknownFormat = "project.unknown-format";
    public const string UnknownUnit = "project.unknown-unit";
    public const string DuplicateId = "project.duplicate-id";
    public const string UnknownCore = "project.unknown-core";
    public const string UnknownMarker = "project.unknown-marker";
    public const string UnknownSignal = "project.unknown-signal";
    public const string IntervalInverted = "project.interval-inverted";
    public const string DepthOutsideCore = "project.depth-outside-core";
    public const string MissingFile = "project.missing-file";
    public const string PathOutsideProject = "project.path-outside-project";
    public const string TableProblem = "table.invalid";
    public const string TableDepthOrder = "table.depth-order";
}
