namespace StratLink.Cli;

/// <summary>Exit codes shared by every verb, so scripts can tell a finding from a mistake in the call.</summary>
public static class ExitCodes
{
    public const int Success = 0;

    /// <summary>The run worked but found errors in the project (check), or a stage failed on the data.</summary>
    public const int Findings = 1;

    /// <summary>Bad usage, unreadable files, or no terminal for the dashboard.</summary>
    public const int Usage = 2;

    /// <summary>Cancelled by the user (Ctrl+C).</summary>
    public const int Cancelled = 130;
}
