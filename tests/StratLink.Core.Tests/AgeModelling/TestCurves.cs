using StratLink.AgeModelling.Calibration;
using StratLink.Checks;
using StratLink.Tests.TestSupport;

namespace StratLink.Tests.AgeModelling;

/// <summary>The real calibration curves from the shared open data (Reimer et al. 2020; Heaton et al. 2020), read once; a missing file fails loudly.</summary>
internal static class TestCurves
{
    private static readonly Lazy<CalibrationCurve> IntCal20Lazy = new(() => Load("intcal20.14c"));
    private static readonly Lazy<CalibrationCurve> Marine20Lazy = new(() => Load("marine20.14c"));

    public static CalibrationCurve IntCal20 => IntCal20Lazy.Value;
    public static CalibrationCurve Marine20 => Marine20Lazy.Value;

    public static string PathOf(string file) => RepoPaths.Data("calibration-curves", file);

    public static CalibrationCurve Load(string file)
    {
        var problems = new FindingList();
        var curve = CalibrationCurve.Load(PathOf(file), problems);
        return curve ?? throw new InvalidOperationException($"Shared calibration curve unreadable: {string.Join("; ", problems)}");
    }
}
