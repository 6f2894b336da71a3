namespace StratLink.ProjectIO;

/// <summary>
/// The JSON Schema of the project file (docs/stratlink-project.schema.json, embedded), written beside
/// new and demo projects so editors with a YAML language server complete and check keys.
/// </summary>
public static class ProjectSchema
{
    public const string FileName = "stratlink-project.schema.json";

    /// <summary>The line that points a YAML language server at the schema beside the project file.</summary>
    public const string ModelineComment = "# yaml-language-server: $schema=" + FileName;

    private static readonly Lazy<string> Content = new(() =>
    {
        using var stream = typeof(ProjectSchema).Assembly.GetManifestResourceStream("StratLink.ProjectIO." + FileName)
            ?? throw new InvalidOperationException("The project schema is not embedded in StratLink.Core.");
        using var reader = new StreamReader(stream);
        return reader.ReadToEnd();
    });

    public static string Text => Content.Value;
}
