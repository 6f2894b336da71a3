namespace StratLink.Cli.Dashboard.Views;

/// <summary>One log of the correlation view: which core and signal it shows, where it is scrolled to and its depth cursor (project unit).</summary>
public sealed class LogSlot
{
    public LogSlot(string coreId, string? signal)
    {
        CoreId = coreId;
        Signal = signal;
    }

    public string CoreId { get; set; }
    public string? Signal { get; set; }

    /// <summary>Depth at the top edge of the first plot row.</summary>
    public double Top { get; set; }

    public double Cursor { get; set; }
}
