namespace StratLink.AgeModelling.Calibration;

/// <summary>Whether a calibration gave a usable calendar-age distribution.</summary>
public enum CalibrationStatus
{
    /// <summary>The distribution lies within the curve.</summary>
    Ok,

    /// <summary>Usable, but the distribution is cut by an end of the curve (see the message).</summary>
    Truncated,

    /// <summary>Younger than every 14C age of the curve: modern (or post-bomb); no calendar age from this curve.</summary>
    Modern,

    /// <summary>Older than the curve reaches: no calendar age from this curve.</summary>
    TooOld,
}
