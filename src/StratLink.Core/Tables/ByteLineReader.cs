namespace StratLink.Tables;

/// <summary>
/// Streams the lines of a byte stream without decoding them: CR, LF and CRLF (mixed freely) each end a
/// line. Working on bytes is safe for UTF-8 and Latin-1 alike, since both keep ASCII bytes (digits,
/// delimiters, line breaks) as they are; only header names and text cells need decoding later.
/// Memory stays bounded: a line longer than <see cref="MaxLineBytes"/> stops the reader.
/// </summary>
internal sealed class ByteLineReader : IDisposable
{
    private readonly Stream _stream;
    private readonly int _maxLineBytes;
    private byte[] _buffer;
    private int _start, _end, _lineStart, _lineLength;
    private bool _eof, _pendingLf, _first = true;

    public ByteLineReader(Stream stream, int maxLineBytes)
    {
        _stream = stream;
        _maxLineBytes = maxLineBytes;
        _buffer = new byte[Math.Min(64 * 1024, maxLineBytes + 2)];
    }

    public int MaxLineBytes => _maxLineBytes;

    /// <summary>1-based number of the line last returned.</summary>
    public int LineNumber { get; private set; }

    /// <summary>True once a line longer than the limit was met (<see cref="LineNumber"/> is its number).</summary>
    public bool LineTooLong { get; private set; }

    /// <summary>The line last read, without its break; valid until the next read.</summary>
    public ReadOnlySpan<byte> Current => _buffer.AsSpan(_lineStart, _lineLength);

    /// <summary>Reads the next line into <see cref="Current"/>; false at the end or at a line that is too long.</summary>
    public bool TryReadLine()
    {
        if (LineTooLong) return false;
        while (true)
        {
            if (_pendingLf && _start < _end)
            {
                // The CR of a CRLF pair ended the previous buffer: drop its LF.
                if (_buffer[_start] == (byte)'\n') _start++;
                _pendingLf = false;
            }
            var span = _buffer.AsSpan(_start, _end - _start);
            int brk = span.IndexOfAny((byte)'\r', (byte)'\n');
            if (brk >= 0)
            {
                SetLine(_start, brk);
                int next = _start + brk + 1;
                if (span[brk] == (byte)'\r')
                {
                    if (next < _end) { if (_buffer[next] == (byte)'\n') next++; }
                    else _pendingLf = true;
                }
                _start = next;
                return Deliver();
            }
            if (_eof)
            {
                if (_start == _end) return false;
                SetLine(_start, span.Length);
                _start = _end;
                return Deliver();
            }
            if (span.Length >= _maxLineBytes)
            {
                LineNumber++;
                LineTooLong = true;
                return false;
            }
            Fill();
        }
    }

    private void SetLine(int start, int length)
    {
        _lineStart = start;
        _lineLength = length;
    }

    private bool Deliver()
    {
        LineNumber++;
        if (_first)
        {
            _first = false;
            if (Current.StartsWith((ReadOnlySpan<byte>)[0xEF, 0xBB, 0xBF])) SetLine(_lineStart + 3, _lineLength - 3);
        }
        if (_lineLength > _maxLineBytes)
        {
            LineTooLong = true;
            return false;
        }
        return true;
    }

    private void Fill()
    {
        if (_start > 0)
        {
            Buffer.BlockCopy(_buffer, _start, _buffer, 0, _end - _start);
            _end -= _start;
            _start = 0;
        }
        if (_end == _buffer.Length)
            Array.Resize(ref _buffer, (int)Math.Min((long)_buffer.Length * 2, _maxLineBytes + 2L));
        int n = _stream.Read(_buffer, _end, _buffer.Length - _end);
        if (n == 0) _eof = true;
        else _end += n;
    }

    public void Dispose() => _stream.Dispose();
}
