namespace StratLink.Checks;

/// <summary>Stable codes of the scientific consistency checks (written to checks.csv; never renamed).</summary>
public static class CheckCodes
{
    /// <summary>Error: marker X above marker Y in some cores and below it in others.</summary>
    public const string TieCrossing = "tie.crossing";

    /// <summary>Error: a marker depth inside a gap (nothing recovered there).</summary>
    public const string TieInGap = "tie.in-gap";

    /// <summary>Warning: a marker depth inside a disturbed interval.</summary>
    public const string TieInDisturbed = "tie.in-disturbed";

    /// <summary>Warning: two markers at the same depth of one core, within their uncertainties.</summary>
    public const string TieSameDepth = "tie.same-depth";

    /// <summary>Warning: the tie-implied accumulation-rate ratio jumps by more than the project's factor.</summary>
    public const string TieRateJump = "tie.rate-jump";

    /// <summary>Warning: the alignment made without a tie places its marker far from the tie.</summary>
    public const string TieMisfit = "tie.misfit";

    /// <summary>Note or warning: worst mismatch of mapping A to C against A to B to C.</summary>
    public const string LoopClosure = "tie.loop-closure";

    /// <summary>Note: a check could not run (no aligner given, the aligner failed on the edited project, a varve table unreadable).</summary>
    public const string CheckNotRun = "check.not-run";

    /// <summary>Error: two age controls of one core in reverse stratigraphic order beyond their errors.</summary>
    public const string AgeReversal = "age.reversal";

    /// <summary>Warning: two age controls of different cores in reverse order on the composite depth scale.</summary>
    public const string AgeReversalAcrossCores = "age.reversal-across-cores";

    /// <summary>Error: a radiocarbon age outside its calibration curve (modern or too old for it).</summary>
    public const string RadiocarbonOutsideCurve = "age.c14-outside-curve";

    /// <summary>Warning: a radiocarbon age whose calendar distribution is cut by an end of its curve.</summary>
    public const string RadiocarbonAtCurveEnd = "age.c14-at-curve-end";

    /// <summary>Warning: the calibration curve of a radiocarbon age could not be read for the checks.</summary>
    public const string CurveUnreadable = "age.curve-unreadable";

    /// <summary>Warning: a varve-count age and an independent age disagree beyond both errors.</summary>
    public const string VarveDisagrees = "age.varve-disagrees";

    /// <summary>Error: a calendar age on a marker that no core holds, so it dates nothing.</summary>
    public const string AgeMarkerUnplaced = "age.marker-unplaced";

    /// <summary>Note: a core with age controls of its own lacks a marker that carries a calendar age.</summary>
    public const string AgeMarkerAbsent = "age.marker-absent";

    /// <summary>Warning: an age control disagrees with the finished age model beyond both ranges.</summary>
    public const string AgeOffModel = "age.off-model";
}
