using StratLink.Cli.Dashboard.Results;
using StratLink.Model;

namespace StratLink.Cli.Dashboard.Views;

/// <summary>The composite depth at which the age model's median reaches an age, for "go to age".</summary>
public static class AgeLookup
{
    private const int Steps = 2000;

    /// <summary>
    /// First composite depth (project unit) whose median age reaches <paramref name="ageBP"/>, by a scan
    /// down the model and linear interpolation between steps; null when the model never reaches it.
    /// </summary>
    public static double? CompositeDepthAt(AgeCurve curve, Project project, double ageBP)
    {
        double top = curve.TopCompositeDepth, bottom = curve.BottomCompositeDepth;
        double step = (bottom - top) / Steps;
        double previousDepth = top, previousAge = Median(curve, project, top);
        if (ageBP <= previousAge) return ageBP == previousAge ? top : null;
        for (int i = 1; i <= Steps; i++)
        {
            double d = top + i * step, a = Median(curve, project, d);
            if (a >= ageBP)
                return a > previousAge ? previousDepth + (ageBP - previousAge) / (a - previousAge) * (d - previousDepth) : d;
            (previousDepth, previousAge) = (d, a);
        }
        return null;
    }

    private static double Median(AgeCurve curve, Project project, double depth) =>
        curve.Scale.AgeAt(project.CompositeDepthOf(depth)).MedianBP;
}
