using System.Text;

namespace StratLink.Tests.Tables;

/// <summary>A scratch folder for one test, deleted afterwards.</summary>
internal sealed class TempFolder : IDisposable
{
    public TempFolder() => Directory.CreateDirectory(Path);

    public string Path { get; } = System.IO.Path.Combine(System.IO.Path.GetTempPath(), "stratlink-tests", Guid.NewGuid().ToString("N"));

    /// <summary>Writes text as UTF-8 bytes exactly as given (line ends included).</summary>
    public string Write(string name, string text) => WriteBytes(name, Encoding.UTF8.GetBytes(text));

    public string WriteBytes(string name, byte[] bytes)
    {
        string full = System.IO.Path.Combine(Path, name);
        Directory.CreateDirectory(System.IO.Path.GetDirectoryName(full)!);
        File.WriteAllBytes(full, bytes);
        return full;
    }

    public void Dispose()
    {
        try { Directory.Delete(Path, recursive: true); }
        catch (IOException) { }
    }
}
