namespace StratLink.Alignment;

/// <summary>
/// A dated target as read from its table: ages ascending in years cal BP, the shared signal at each, and the
/// target's own 1-sigma age error in years (null when the table gives none). Rows without a signal value are left out.
/// </summary>
public sealed record DatedTargetRecord(double[] AgesBP, double[] Values, double[]? ErrorsYears)
{
    /// <summary>The target's age error at an age, linearly interpolated from its table (constant beyond its ends); 0 without an error column.</summary>
    public double ErrorAt(double ageBP)
    {
        if (ErrorsYears is not { } e) return 0;
        int i = Array.BinarySearch(AgesBP, ageBP);
        if (i >= 0) return e[i];
        i = ~i;
        if (i == 0) return e[0];
        if (i == AgesBP.Length) return e[^1];
        double w = (ageBP - AgesBP[i - 1]) / (AgesBP[i] - AgesBP[i - 1]);
        return e[i - 1] + w * (e[i] - e[i - 1]);
    }
}
