namespace StratLink.Cli.Dashboard.Drawing;

/// <summary>Draws a binned signal as a vertical log (depth down, value across) on a dot canvas.</summary>
public static class CurvePlotter
{
    /// <summary>
    /// Each dot row gets a run from its minimum to its maximum; consecutive rows with samples are
    /// joined, except across rows where <paramref name="breakAt"/> is true (gaps in the core).
    /// </summary>
    public static void DrawVertical(DotCanvas canvas, SignalBins bins, double valueMin, double valueMax, Func<int, bool> breakAt)
    {
        double span = valueMax - valueMin;
        if (!(span > 0)) span = 1;
        int width = canvas.DotWidth;
        int X(double v) => Math.Clamp((int)Math.Round((v - valueMin) / span * (width - 1)), 0, width - 1);

        int previousRow = -1, previousX = 0;
        for (int y = 0; y < bins.Count && y < canvas.DotHeight; y++)
        {
            if (breakAt(y)) { previousRow = -1; continue; }
            if (double.IsNaN(bins.Min[y])) continue;
            int x0 = X(bins.Min[y]), x1 = X(bins.Max[y]);
            canvas.Run(x0, x1, y);
            int mid = (x0 + x1) / 2;
            if (previousRow >= 0) canvas.Line(previousX, previousRow, mid, y);
            previousRow = y;
            previousX = mid;
        }
    }

    /// <summary>A line through (value, dot row) points, value across, with NaN breaking the line.</summary>
    public static void DrawProfile(DotCanvas canvas, double[] values, double valueMin, double valueMax)
    {
        double span = valueMax - valueMin;
        if (!(span > 0)) span = 1;
        int width = canvas.DotWidth;
        int previous = -1, previousX = 0;
        for (int y = 0; y < values.Length && y < canvas.DotHeight; y++)
        {
            if (double.IsNaN(values[y])) { previous = -1; continue; }
            int x = Math.Clamp((int)Math.Round((values[y] - valueMin) / span * (width - 1)), 0, width - 1);
            if (previous >= 0) canvas.Line(previousX, previous, x, y); else canvas.Set(x, y);
            previous = y;
            previousX = x;
        }
    }
}
