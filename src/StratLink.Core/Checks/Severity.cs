namespace StratLink.Checks;

/// <summary>How serious a finding is. Only errors make <c>stratlink check</c> exit non-zero.</summary>
public enum Severity
{
    Note,
    Warning,
    Error,
}
