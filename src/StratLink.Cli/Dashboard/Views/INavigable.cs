namespace StratLink.Cli.Dashboard.Views;

/// <summary>
/// The one navigation model of the plotting screens (Logs, Ages, Composite): the same keys move a
/// cursor along the vertical axis, page, go to either end, zoom on the 1-2-5 ladder, go to a typed
/// depth or age, and fit the whole record on screen.
/// </summary>
public interface INavigable
{
    void MoveCursorRows(double rows);
    void PageRows(int direction);
    void ToEnd(bool bottom);

    /// <summary>False when already at the closest or widest step.</summary>
    bool Zoom(bool zoomIn);

    void FitAll();

    /// <summary>Moves the cursor to the target; returns why it could not, or null when it did.</summary>
    string? JumpTo(JumpTarget target);

    /// <summary>What the go-to prompt asks for on this screen.</summary>
    string JumpPrompt { get; }

    /// <summary>The scale as a user reads it, e.g. "20 cm per row".</summary>
    string ScaleText { get; }
}
