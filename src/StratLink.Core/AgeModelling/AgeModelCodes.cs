namespace StratLink.AgeModelling;

/// <summary>Stable codes of the age model's findings.</summary>
public static class AgeModelCodes
{
    public const string TooFewControls = "age-model.too-few-controls";
    public const string NoControls = "age-model.no-controls";
    public const string UnknownMarker = "age-model.unknown-marker";
    public const string NoMapping = "age-model.no-mapping";
    public const string Calibration = "age-model.calibration";
    public const string Curve = "age-model.curve";
    public const string VarveTable = "age-model.varve-table";
    public const string Contradicted = "age-model.contradicted";
    public const string Excluded = "age-model.excluded";
    public const string OrderForced = "age-model.order-forced";
    public const string Extrapolated = "age-model.extrapolated";
    public const string Outlier = "age-model.outlier";
    public const string FewEffective = "age-model.effective-members";
    public const string TargetAges = "age-model.target-ages";
    public const string AfterCoring = "age-model.after-coring";
}
