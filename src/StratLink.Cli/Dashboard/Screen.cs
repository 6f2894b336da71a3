namespace StratLink.Cli.Dashboard;

/// <summary>The dashboard's screens, in the order of their number keys.</summary>
public enum Screen
{
    Logs,
    Ages,
    Composite,
    Findings,
}

public static class Screens
{
    public static string Title(this Screen screen) => screen switch
    {
        Screen.Logs => "Logs",
        Screen.Ages => "Ages",
        Screen.Composite => "Composite",
        Screen.Findings => "Findings",
        _ => throw new ArgumentOutOfRangeException(nameof(screen)),
    };

    public static readonly IReadOnlyList<Screen> All = Enum.GetValues<Screen>();
}
