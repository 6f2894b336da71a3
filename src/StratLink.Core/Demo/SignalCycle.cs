namespace StratLink.Demo;

/// <summary>A sinusoid in the true climate signal: Amplitude * sin(2 pi age / PeriodYears + PhaseRadians), age in cal BP.</summary>
public sealed record SignalCycle(double PeriodYears, double Amplitude, double PhaseRadians)
{
    public double ValueAt(double ageBP) => Amplitude * Math.Sin(2 * Math.PI * ageBP / PeriodYears + PhaseRadians);
}
