namespace StratLink.Cli.Dashboard.Views;

/// <summary>
/// The vertical axis of a plot as the user scrolls and zooms it: the data's extent, the value at the
/// top edge of the first row, the value per row (on the 1-2-5 ladder) and a cursor that always stays
/// on screen. The Ages and Composite screens each keep one per axis (composite depth, age).
/// </summary>
public sealed class AxisWindow
{
    public double Min { get; private set; }
    public double Max { get; private set; } = 1;
    public int Rows { get; private set; } = 1;
    public double Top { get; private set; }
    public double PerRow { get; private set; } = 1;
    public double Cursor { get; private set; }
    public bool Fitted { get; private set; }

    public double Bottom => Top + Rows * PerRow;

    /// <summary>The data's extent and the rows available; a new extent fits the whole of it again.</summary>
    public void SetExtent(double min, double max, int rows)
    {
        if (!(max > min)) max = min + 1;
        rows = Math.Max(1, rows);
        bool changed = !Fitted || min != Min || max != Max;
        (Min, Max) = (min, max);
        if (changed)
        {
            Rows = rows;
            FitAll();
            return;
        }
        if (rows == Rows) return;
        Rows = rows;
        KeepVisible();
    }

    /// <summary>The whole extent on screen: the smallest ladder step per row that holds it, cursor at the top.</summary>
    public void FitAll()
    {
        PerRow = CorrelationView.NiceAtLeast((Max - Min) / Rows);
        Top = Min;
        Cursor = Math.Clamp(Cursor, Min, Max);
        Fitted = true;
    }

    public void MoveRows(double rows) => MoveTo(Cursor + rows * PerRow);

    public void Page(int direction) => MoveRows(direction * Math.Max(1, Rows - 1));

    public void ToEnd(bool bottom) => MoveTo(bottom ? Max : Min);

    /// <summary>Puts the cursor at <paramref name="value"/> (clamped to the extent), scrolling so it shows.</summary>
    public void MoveTo(double value)
    {
        Cursor = Math.Clamp(value, Min, Max);
        KeepVisible();
    }

    /// <summary>One step down (in) or up (out) the 1-2-5 ladder around the cursor; false at the limits.</summary>
    public bool Zoom(bool zoomIn)
    {
        double fit = CorrelationView.NiceAtLeast((Max - Min) / Rows);
        double next = CorrelationView.NiceStep(PerRow, zoomIn ? -1 : 1);
        if (next < fit * 1e-3 || next > fit * (1 + 1e-9)) return false;
        double row = (Cursor - Top) / PerRow;
        Top = Cursor - row * next;
        PerRow = next;
        KeepVisible();
        return true;
    }

    /// <summary>Row of <paramref name="value"/> (may lie outside 0..Rows-1).</summary>
    public int RowOf(double value) => (int)Math.Floor((value - Top) / PerRow);

    private void KeepVisible()
    {
        int row = RowOf(Cursor);
        if (row < 0) Top = Cursor - Math.Min(2, Rows - 1) * PerRow;
        else if (row >= Rows) Top = Cursor - Math.Max(0, Rows - 3) * PerRow;
        // Never scroll further than the data: the extent's ends stay at the screen's edges at most.
        double span = Rows * PerRow;
        if (span >= Max - Min) Top = Math.Clamp(Top, Max - span, Min);
        else Top = Math.Clamp(Top, Min, Max - span + PerRow);
    }
}
