namespace StratLink.Cli.Dashboard.Dialogs;

/// <summary>The questions the dashboard asks; dialogs in the program, scripted answers in tests.</summary>
public interface IPrompts
{
    /// <summary>Asks for a line of text; null when cancelled.</summary>
    string? AskText(string title, string label, string initial);

    /// <summary>Offers <paramref name="options"/>; the index chosen, or null when cancelled.</summary>
    int? Choose(string title, string message, IReadOnlyList<string> options, int initial = 0);

    /// <summary>Shows read-only text (the help screen) until dismissed.</summary>
    void ShowText(string title, IReadOnlyList<string> lines);
}
