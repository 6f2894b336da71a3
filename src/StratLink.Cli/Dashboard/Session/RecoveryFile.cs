using StratLink.Model;
using StratLink.ProjectIO;

namespace StratLink.Cli.Dashboard.Session;

/// <summary>
/// Unsaved edits, written after every edit to <c>.NAME.recovery.yaml</c> beside the project file
/// (same folder, so the relative table paths inside stay valid). A dropped connection then loses
/// nothing: the next start offers the edits back. Saving or discarding removes the file.
/// </summary>
public sealed class RecoveryFile
{
    public RecoveryFile(string projectPath)
    {
        string full = Path.GetFullPath(projectPath);
        ProjectPath = full;
        FilePath = Path.Combine(Path.GetDirectoryName(full) ?? ".", $".{Path.GetFileNameWithoutExtension(full)}.recovery.yaml");
    }

    public string ProjectPath { get; }
    public string FilePath { get; }

    public bool Exists => File.Exists(FilePath);

    /// <summary>When the recovered edits were written (local time), or null when there are none.</summary>
    public DateTime? WrittenAt => Exists ? File.GetLastWriteTime(FilePath) : null;

    public void Write(Project project) => AtomicFile.WriteAllText(FilePath, ProjectWriter.ToYaml(project), keepBackup: false);

    /// <summary>Reads the recovered project as if it were the project file (same folder, same messages).</summary>
    public ProjectDocument Read() => ProjectReader.Parse(File.ReadAllText(FilePath), ProjectPath);

    public void Delete()
    {
        if (File.Exists(FilePath)) File.Delete(FilePath);
    }
}
