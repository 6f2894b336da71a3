using System.Text;

namespace StratLink.ProjectIO;

/// <summary>
/// Writes files so that a crash at any moment leaves either the old or the new content complete:
/// write a temporary file beside the target, flush it to disk, keep the old file as NAME.bak, then
/// rename over the target (rename is atomic on one file system).
/// </summary>
public static class AtomicFile
{
    private static readonly UTF8Encoding Utf8NoBom = new(false);

    public static void WriteAllText(string path, string text, bool keepBackup = true) =>
        Write(path, w => w.Write(text), keepBackup);

    /// <summary>Streams the content through <paramref name="write"/> (large tables are never held as one string).</summary>
    public static void Write(string path, Action<TextWriter> write, bool keepBackup = true) =>
        WriteBytes(path, stream =>
        {
            using var w = new StreamWriter(stream, Utf8NoBom, 64 * 1024, leaveOpen: true) { NewLine = "\n" };
            write(w);
        }, keepBackup);

    /// <summary>The same for binary content (a zip archive).</summary>
    public static void WriteBytes(string path, Action<Stream> write, bool keepBackup = true)
    {
        string full = Path.GetFullPath(path);
        string dir = Path.GetDirectoryName(full) ?? ".";
        Directory.CreateDirectory(dir);
        string temp = Path.Combine(dir, $".{Path.GetFileName(full)}.{Environment.ProcessId}.{Guid.NewGuid():N}.tmp");
        string tempBackup = temp + ".bak";
        try
        {
            using (var fs = new FileStream(temp, FileMode.CreateNew, FileAccess.Write, FileShare.None, 64 * 1024))
            {
                write(fs);
                fs.Flush(flushToDisk: true);
            }
            // Copy (not move) the old file to the backup, so the target is never absent; the copy goes
            // to a temporary name first, so an interrupted copy cannot leave a half-written backup.
            if (keepBackup && File.Exists(full))
            {
                File.Copy(full, tempBackup, overwrite: true);
                File.Move(tempBackup, full + ".bak", overwrite: true);
            }
            File.Move(temp, full, overwrite: true);
            RemoveStaleTemporaries(dir, Path.GetFileName(full));
        }
        finally
        {
            if (File.Exists(temp)) File.Delete(temp);
            if (File.Exists(tempBackup)) File.Delete(tempBackup);
        }
    }

    /// <summary>
    /// A save killed half-way leaves its temporary file behind (the target itself is intact); the next
    /// successful save of the same file removes such leftovers. Only files of processes that are gone
    /// are removed, so two programs saving the same file never delete each other's work in flight.
    /// </summary>
    private static void RemoveStaleTemporaries(string dir, string name)
    {
        foreach (string file in Directory.EnumerateFiles(dir, $".{name}.*.tmp*"))
        {
            string rest = Path.GetFileName(file)[(name.Length + 2)..];
            int dot = rest.IndexOf('.');
            if (dot <= 0 || !int.TryParse(rest[..dot], out int pid) || IsAlive(pid)) continue;
            try { File.Delete(file); }
            catch (IOException) { }
            catch (UnauthorizedAccessException) { }
        }
    }

    private static bool IsAlive(int pid)
    {
        if (pid == Environment.ProcessId) return false;
        try
        {
            using var p = System.Diagnostics.Process.GetProcessById(pid);
            return !p.HasExited;
        }
        catch (ArgumentException)
        {
            return false;
        }
        catch (InvalidOperationException)
        {
            return false;
        }
    }
}
