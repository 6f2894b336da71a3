using System.Diagnostics;
using StratLink.Workflows;

namespace StratLink.Cli;

/// <summary>
/// A one-line progress bar on stderr, only when stderr is a terminal and only once the work has run
/// for about a second (short runs stay quiet; logs and pipes never get control characters).
/// </summary>
internal sealed class ConsoleProgress : IProgress<WorkProgress>, IDisposable
{
    private static readonly TimeSpan Delay = TimeSpan.FromSeconds(1);
    private readonly TextWriter _err;
    private readonly bool _enabled;
    private readonly Stopwatch _clock = Stopwatch.StartNew();
    private readonly Lock _gate = new();
    private bool _drawn;
    private string _last = "";

    public ConsoleProgress(CliContext ctx)
    {
        _err = ctx.Error;
        _enabled = ctx.ErrorIsTerminal;
    }

    public void Report(WorkProgress value)
    {
        if (!_enabled || _clock.Elapsed < Delay) return;
        int width = 30, filled = (int)Math.Round(Math.Clamp(value.Fraction, 0, 1) * width);
        string line = $"\r{value.Stage,-12} [{new string('#', filled)}{new string('.', width - filled)}] {value.Fraction * 100,3:0}% {value.Detail}";
        lock (_gate)
        {
            if (line == _last) return;
            // Pad over a longer previous line instead of relying on terminal erase codes.
            _err.Write(line.PadRight(_last.Length));
            _err.Flush();
            _last = line;
            _drawn = true;
        }
    }

    public void Dispose()
    {
        lock (_gate)
        {
            if (_drawn) _err.Write("\r" + new string(' ', _last.Length) + "\r");
        }
    }
}
