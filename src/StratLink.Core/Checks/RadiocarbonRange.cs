namespace StratLink.Checks;

/// <summary>The span of conventional radiocarbon ages (14C yr BP) a calibration curve covers.</summary>
public readonly record struct RadiocarbonRange(double Youngest, double Oldest)
{
    public bool Contains(double c14Years) => c14Years >= Youngest && c14Years <= Oldest;
}
