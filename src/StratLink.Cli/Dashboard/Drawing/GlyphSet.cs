namespace StratLink.Cli.Dashboard.Drawing;

/// <summary>
/// The characters the dashboard draws with: Unicode (braille dots, shading, box lines) when the
/// terminal's locale is UTF-8, plain ASCII otherwise, so a C-locale SSH session still reads well.
/// </summary>
public sealed record GlyphSet
{
    public required bool Unicode { get; init; }

    /// <summary>Ink of a curve cell in ASCII mode (Unicode mode uses braille patterns).</summary>
    public required char CurveInk { get; init; }
    public required string Gap { get; init; }
    public required string Disturbed { get; init; }

    /// <summary>Shading of an event layer (an instantaneous deposit), a shape apart from gaps and disturbed intervals.</summary>
    public required string EventLayer { get; init; }
    public required string Band { get; init; }
    public required string TieMark { get; init; }

    /// <summary>A tie at an event layer (turbidite, flood bed, other event): a shape of its own, so events read without colour.</summary>
    public required string EventTieMark { get; init; }

    /// <summary>The selected tie's mark: a different shape, not only a different colour.</summary>
    public required string SelectedTieMark { get; init; }

    /// <summary>Where a tie between two logs further apart passes a log that does not hold it.</summary>
    public required string TieThrough { get; init; }

    /// <summary>Before the active log's name; <see cref="PartnerLog"/> before the log new ties go to.</summary>
    public required string ActiveLog { get; init; }
    public required string PartnerLog { get; init; }

    /// <summary>An age control left out of the age model (a hollow mark, where a used one is solid).</summary>
    public required string ExcludedControlMark { get; init; }
    public required string ControlMark { get; init; }
    public required string ErrorBar { get; init; }
    public required string Separator { get; init; }
    public required string BarFull { get; init; }
    public required string BarEmpty { get; init; }
    public required string Up { get; init; }
    public required string Down { get; init; }

    public static readonly GlyphSet Utf8 = new()
    {
        Unicode = true, CurveInk = '*', Gap = "░", Disturbed = "▚", EventLayer = "≡", Band = "▒", TieMark = "◆",
        EventTieMark = "▼", SelectedTieMark = "◈", TieThrough = "┄", ActiveLog = "▸", PartnerLog = "⇔", ExcludedControlMark = "○",
        ControlMark = "●", ErrorBar = "─", Separator = "│", BarFull = "█", BarEmpty = "░", Up = "↑", Down = "↓",
    };

    public static readonly GlyphSet Ascii = new()
    {
        Unicode = false, CurveInk = '*', Gap = ":", Disturbed = "~", EventLayer = "%", Band = ".", TieMark = "#",
        EventTieMark = "v", SelectedTieMark = "@", TieThrough = "-", ActiveLog = ">", PartnerLog = "=", ExcludedControlMark = "x",
        ControlMark = "o", ErrorBar = "-", Separator = "|", BarFull = "#", BarEmpty = "-", Up = "Up", Down = "Dn",
    };

    /// <summary>
    /// UTF-8 when the effective character-type locale says so. POSIX precedence: LC_ALL, then
    /// LC_CTYPE, then LANG; the first one set decides. Nothing set means the C locale (ASCII).
    /// </summary>
    public static GlyphSet FromLocale(Func<string, string?> getEnv)
    {
        foreach (string name in new[] { "LC_ALL", "LC_CTYPE", "LANG" })
        {
            string? value = getEnv(name);
            if (string.IsNullOrEmpty(value)) continue;
            return IsUtf8Locale(value) ? Utf8 : Ascii;
        }
        return Ascii;
    }

    /// <summary>The mark of a tie of this kind in a log: events (turbidites, flood beds, other events) apart from the rest.</summary>
    public string TieMarkOf(StratLink.Model.MarkerKind kind) =>
        kind is StratLink.Model.MarkerKind.Turbidite or StratLink.Model.MarkerKind.Flood or StratLink.Model.MarkerKind.Event ? EventTieMark : TieMark;

    public static bool IsUtf8Locale(string locale) =>
        locale.Contains("UTF-8", StringComparison.OrdinalIgnoreCase) || locale.Contains("utf8", StringComparison.OrdinalIgnoreCase);
}
