namespace StratLink.Cli.Dashboard.Views;

/// <summary>The selected line of a list and the first line shown, kept so the selection stays in view.</summary>
public sealed class ListSelection
{
    public int Selected { get; private set; }
    public int First { get; private set; }

    public void Move(int delta, int count)
    {
        Selected = count == 0 ? 0 : Math.Clamp(Selected + delta, 0, count - 1);
    }

    /// <summary>Scrolls so the selection lies within <paramref name="rows"/> lines; call before drawing.</summary>
    public void Fit(int count, int rows)
    {
        Selected = count == 0 ? 0 : Math.Clamp(Selected, 0, count - 1);
        if (rows <= 0) return;
        if (Selected < First) First = Selected;
        if (Selected >= First + rows) First = Selected - rows + 1;
        First = Math.Clamp(First, 0, Math.Max(0, count - rows));
    }
}
