namespace StratLink.Analysis;

/// <summary>How a Lomb-Scargle power is scaled (VanderPlas 2018, ApJS 236:16, section 7.1).</summary>
public enum LombScargleNormalisation
{
    /// <summary>Divided by twice the sample variance (N-1): the classical power of Scargle 1982 / Horne and Baliunas 1986, exponential under white noise.</summary>
    Psd,

    /// <summary>Divided by the total sum of squares: the share of variance explained by the sinusoid, in [0, 1].</summary>
    Standard,
}
