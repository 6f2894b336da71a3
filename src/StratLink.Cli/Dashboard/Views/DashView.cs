using System.Text;
using StratLink.Cli.Dashboard.Drawing;
using Terminal.Gui.Drawing;
using Terminal.Gui.ViewBase;
using Attribute = Terminal.Gui.Drawing.Attribute;

namespace StratLink.Cli.Dashboard.Views;

/// <summary>Base of the dashboard's hand-drawn views: text and glyph helpers in viewport coordinates, clipped to the viewport.</summary>
public abstract class DashView : View
{
    protected DashView(GlyphSet glyphs)
    {
        Glyphs = glyphs;
        CanFocus = false;
    }

    public GlyphSet Glyphs { get; }

    /// <summary>Set by the window for every view: sixteen colours or monochrome.</summary>
    public ColourMode ColourMode { get; set; }

    protected Palette Colors => Palette.From(GetAttributeForRole(VisualRole.Normal), ColourMode);

    /// <summary>Writes <paramref name="text"/> at (x, y), cut at <paramref name="maxWidth"/> and the viewport edge.</summary>
    protected void Put(int x, int y, string text, Attribute attribute, int maxWidth = int.MaxValue)
    {
        var vp = Viewport;
        if (y < 0 || y >= vp.Height || x >= vp.Width || text.Length == 0) return;
        int limit = (int)Math.Min(vp.Width, (long)x + Math.Max(0, maxWidth));
        if (x < 0)
        {
            text = SkipRunes(text, -x);
            x = 0;
        }
        // One call per run of text: the toolkit's per-call cost (clipping, cell updates) dominates drawing.
        if (text.Length > limit - x) text = TakeRunes(text, limit - x);
        if (text.Length == 0) return;
        SetAttribute(attribute);
        AddStr(x, y, text);
    }

    protected void Fill(int x, int y, int width, string glyph, Attribute attribute)
    {
        if (width <= 0) return;
        Put(x, y, string.Concat(Enumerable.Repeat(glyph, width)), attribute);
    }

    protected void ClearViewport(Attribute attribute)
    {
        var vp = Viewport;
        SetAttribute(attribute);
        // One fill of the whole viewport: writing rows of blanks as text costs the toolkit far more per cell.
        FillRect(new System.Drawing.Rectangle(0, 0, vp.Width, vp.Height), new Rune(' '));
    }

    private static string TakeRunes(string text, int count)
    {
        if (count <= 0) return "";
        int taken = 0, index = 0;
        foreach (Rune r in text.EnumerateRunes())
        {
            if (taken == count) break;
            index += r.Utf16SequenceLength;
            taken++;
        }
        return text[..index];
    }

    private static string SkipRunes(string text, int count)
    {
        int skipped = 0, index = 0;
        foreach (Rune r in text.EnumerateRunes())
        {
            if (skipped == count) break;
            index += r.Utf16SequenceLength;
            skipped++;
        }
        return text[index..];
    }

    /// <summary>Draws a dot canvas at (x, y), inked cells only, so shading drawn before stays where there is no curve.</summary>
    protected void PutCanvas(int x, int y, DotCanvas canvas, Attribute attribute)
    {
        var run = new StringBuilder();
        for (int r = 0; r < canvas.Rows; r++)
        {
            int start = -1;
            for (int c = 0; c <= canvas.Columns; c++)
            {
                bool inked = c < canvas.Columns && canvas.IsInked(c, r);
                if (inked)
                {
                    if (start < 0) start = c;
                    run.Append(canvas.CellRune(c, r, Glyphs.Unicode, Glyphs.CurveInk).ToString());
                }
                else if (start >= 0)
                {
                    Put(x + start, y + r, run.ToString(), attribute);
                    run.Clear();
                    start = -1;
                }
            }
        }
    }

    /// <summary>Text fitted to exactly <paramref name="width"/> columns (cut or padded).</summary>
    protected static string Fit(string text, int width)
    {
        if (width <= 0) return "";
        return text.Length > width ? text[..width] : text.PadRight(width);
    }
}
