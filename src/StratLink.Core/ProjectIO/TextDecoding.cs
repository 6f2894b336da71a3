using System.Text;

namespace StratLink.ProjectIO;

/// <summary>UTF-8 when the bytes are valid UTF-8 (BOM or not), else Latin-1: old lab files are often Latin-1 (degree signs).</summary>
public static class TextDecoding
{
    private static readonly UTF8Encoding StrictUtf8 = new(encoderShouldEmitUTF8Identifier: false, throwOnInvalidBytes: true);

    public static Encoding Detect(ReadOnlySpan<byte> head)
    {
        if (head.StartsWith(Encoding.UTF8.Preamble)) return Encoding.UTF8;
        return IsUtf8(head) ? Encoding.UTF8 : Encoding.Latin1;
    }

    public static string Decode(byte[] bytes)
    {
        int skip = bytes.AsSpan().StartsWith(Encoding.UTF8.Preamble) ? 3 : 0;
        try { return StrictUtf8.GetString(bytes, skip, bytes.Length - skip); }
        catch (DecoderFallbackException) { return Encoding.Latin1.GetString(bytes); }
    }

    /// <summary>True when the span is valid UTF-8, allowing a multi-byte sequence cut at the end (a probe of a file's head).</summary>
    private static bool IsUtf8(ReadOnlySpan<byte> bytes)
    {
        for (int cut = 0; cut <= 3 && cut < bytes.Length; cut++)
            if (System.Text.Unicode.Utf8.IsValid(bytes[..(bytes.Length - cut)])) return true;
        return bytes.Length == 0;
    }
}
