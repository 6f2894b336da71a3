namespace StratLink.Cli.Dashboard.Keys;

/// <summary>
/// One row of the key table: the keys, the command, where it works (no screens = everywhere), a
/// short label for the status line, a sentence for the help screen, and its place in the status
/// line (0 = help screen only; lower numbers are shown first and kept when the line is short).
/// <see cref="StatusKeys"/>, when given, is what the status line shows for the key (one item for a pair such as "+/-").
/// </summary>
public sealed record KeyEntry(DashCommand Command, IReadOnlyList<Screen> Screens, string Label, string Help, int StatusOrder, IReadOnlyList<KeyChord> Keys,
    string? StatusKeys = null)
{
    public bool Everywhere => Screens.Count == 0;

    public bool AppliesTo(Screen screen) => Everywhere || Screens.Contains(screen);

    /// <summary>All the keys, as the help screen lists them ("]" or "Del/Backspace").</summary>
    public string KeysText => string.Join("/", Keys.Select(k => k.Label));
}
