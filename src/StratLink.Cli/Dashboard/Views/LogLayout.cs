namespace StratLink.Cli.Dashboard.Views;

/// <summary>
/// Columns of the correlation view: for each log a depth axis and a plot, with a gutter between
/// neighbouring logs where ties and correspondence lines run. Gutters widen on wide screens.
/// </summary>
public sealed record LogLayout(int Logs, int AxisWidth, int PlotWidth, int GutterWidth)
{
    public const int Axis = 7;

    public static LogLayout For(int width, int logs)
    {
        int gutter = width >= 150 ? 10 : width >= 100 ? 7 : logs <= 2 ? 6 : 4;
        int plot = (width - logs * Axis - (logs - 1) * gutter) / Math.Max(1, logs);
        if (plot < NarrowestPlot)
        {
            gutter = 2;
            plot = Math.Max(1, (width - logs * Axis - (logs - 1) * gutter) / Math.Max(1, logs));
        }
        return new LogLayout(logs, Axis, plot, gutter);
    }

    /// <summary>Narrowest plot a log is still drawn with (8 dots across).</summary>
    public const int NarrowestPlot = 4;

    /// <summary>How many logs fit across <paramref name="width"/> columns with plots at least <see cref="NarrowestPlot"/> wide (at least two).</summary>
    public static int MostLogs(int width)
    {
        int n = 2;
        while (For(width, n + 1).PlotWidth >= NarrowestPlot && (n + 1) * Axis < width) n++;
        return n;
    }

    public int SlotLeft(int i) => i * (AxisWidth + PlotWidth + GutterWidth);
    public int PlotLeft(int i) => SlotLeft(i) + AxisWidth;
    public int GutterLeft(int i) => PlotLeft(i) + PlotWidth;
    public int SlotWidth => AxisWidth + PlotWidth;
}
