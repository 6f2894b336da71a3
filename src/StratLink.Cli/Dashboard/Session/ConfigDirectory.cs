namespace StratLink.Cli.Dashboard.Session;

/// <summary>The user's StratLink settings folder: $XDG_CONFIG_HOME/stratlink, else ~/.config/stratlink.</summary>
public static class ConfigDirectory
{
    public static string Resolve(Func<string, string?> getEnv)
    {
        string? xdg = getEnv("XDG_CONFIG_HOME");
        string baseDir = !string.IsNullOrWhiteSpace(xdg) && Path.IsPathRooted(xdg)
            ? xdg
            : Path.Combine(getEnv("HOME") ?? Environment.GetFolderPath(Environment.SpecialFolder.UserProfile), ".config");
        return Path.Combine(baseDir, "stratlink");
    }
}
