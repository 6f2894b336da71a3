using Terminal.Gui.Drivers;
using Terminal.Gui.Input;

namespace StratLink.Cli.Dashboard.Keys;

/// <summary>
/// One key: a printable character (matched by the character typed, so <c>U</c> and <c>u</c> differ
/// and layouts do not matter) or a special key with its modifiers.
/// </summary>
public readonly record struct KeyChord(KeyCode Code, char? Character, string Label)
{
    public static KeyChord Char(char c) => new(KeyCode.Null, c, c.ToString());

    public static KeyChord Special(KeyCode code, string label) => new(code, null, label);

    public bool Matches(Key key)
    {
        if (Character is char c)
            return !key.IsCtrl && !key.IsAlt && key.TryGetPrintableRune(out var rune) && rune.Value == c;
        return key.KeyCode == Code;
    }

    /// <summary>The key as a test or script would send it.</summary>
    public Key ToKey() => Character is char c ? new Key(c) : new Key(Code);
}
