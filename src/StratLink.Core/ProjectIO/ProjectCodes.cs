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
    public const string IntervalOverlap = "project.interval-overlap";
    public const string EventInGap = "project.event-in-gap";
    public const string EventThickerThanCore = "project.event-thicker-than-core";
    public const string MarkerOutsideEvent = "project.marker-outside-event";
    public const string VarvesOutsideCore = "project.varves-outside-core";
    public const string DepthOutsideCore = "project.depth-outside-core";
    public const string MissingFile = "project.missing-file";
    public const string PathOutsideProject = "project.path-outside-project";
    public const string TableProblem = "table.invalid";
    public const string TableDepthOrder = "table.depth-order";
    public const string TableNoHeader = "table.no-header";
    public const string TableDuplicateColumn = "table.duplicate-column";
    public const string TableMissingColumn = "table.missing-column";
    public const string TableBadCell = "table.bad-cell";
    public const string TableFieldCount = "table.field-count";
    public const string TableMissingDepth = "table.missing-depth";
    public const string TableUnknownSection = "table.unknown-section";
    public const string TableNotNumeric = "table.not-numeric";
    public const string TableLineTooLong = "table.line-too-long";
    public const string TableIntervalInverted = "table.interval-inverted";
    public const string TableIntervalOverlap = "table.interval-overlap";
    public const string TableMixedDecimalMarks = "table.mixed-decimal-marks";
    public const string TableSectionsIgnored = "table.sections-ignored";
    public const string TableEmpty = "table.empty";
    public const string TableRepeatsCombined = "table.repeats-combined";
    public const string TableAgeOrder = "table.age-order";
    public const string TableBeyondAgeModel = "table.beyond-age-model";
}
