using System.Globalization;
using StratLink.Cli.Dashboard.Drawing;
using StratLink.Workflows;

namespace StratLink.Cli.Dashboard.Views;

public enum MessageLevel
{
    Info,
    Warning,
    Error,
}

/// <summary>One row above the keys: the progress of a run with its bar, or the last message.</summary>
public sealed class MessageBar : DashView
{
    public MessageBar(GlyphSet glyphs) : base(glyphs) => Height = 1;

    public string Message { get; private set; } = "";
    public MessageLevel Level { get; private set; }

    /// <summary>The running stage, or null when nothing runs.</summary>
    public WorkProgress? Progress { get; private set; }

    public void Show(string message, MessageLevel level = MessageLevel.Info)
    {
        Message = message;
        Level = level;
        SetNeedsDraw();
    }

    public void ShowProgress(WorkProgress? progress)
    {
        Progress = progress;
        SetNeedsDraw();
    }

    public static string ProgressText(WorkProgress p, int width, GlyphSet glyphs)
    {
        double f = Math.Clamp(p.Fraction, 0, 1);
        string pct = (f * 100).ToString("0", CultureInfo.InvariantCulture) + "%";
        string head = $" Running: {p.Stage} {pct} ";
        string tail = "  x stops";
        int barWidth = Math.Clamp(width - head.Length - tail.Length - 2, 0, 30);
        int full = (int)Math.Round(f * barWidth);
        string bar = barWidth > 0
            ? "[" + string.Concat(Enumerable.Repeat(glyphs.BarFull, full)) + string.Concat(Enumerable.Repeat(glyphs.BarEmpty, barWidth - full)) + "]"
            : "";
        return head + bar + tail;
    }

    protected override bool OnDrawingContent(Terminal.Gui.ViewBase.DrawContext? context)
    {
        var pal = Colors;
        ClearViewport(pal.Normal);
        if (Progress is { } p)
        {
            Put(0, 0, ProgressText(p, Viewport.Width, Glyphs), pal.Warning);
            return true;
        }
        var attr = Level switch
        {
            MessageLevel.Error => pal.Error,
            MessageLevel.Warning => pal.Warning,
            _ => pal.Normal,
        };
        Put(0, 0, " " + Message, attr);
        return true;
    }
}
