using System.Diagnostics;

namespace StratLink.Workflows;

/// <summary>
/// Time spent in each stage of a run (load, prepare, align, ensemble, ages, composite, checks,
/// write), for run.json and <c>build --verbose</c>. A recording is started once per run and flows
/// with the execution context into parallel work, so any code of the pipeline can mark its stage
/// with <see cref="Measure"/> without a recorder being passed along; with none started, marking
/// costs nothing. A stage's figure is time summed over the flows that ran it: cores are aligned in
/// parallel, one flow each, so prepare, align and ensemble together can exceed the wall time.
/// </summary>
public sealed class StageTimes
{
    /// <summary>The stages in pipeline order; any others measured are listed after them.</summary>
    private static readonly string[] Order = ["load", "prepare", "align", "ensemble", "ages", "composite", "checks", "write"];

    /// <summary>Stages measured within another one and reported apart from it.</summary>
    private static readonly HashSet<(string Outer, string Inner)> Parts = [("align", "ensemble")];

    private static readonly AsyncLocal<StageTimes?> s_current = new();
    private readonly Dictionary<string, long> _ticks = new(StringComparer.Ordinal);
    private readonly long _started = Stopwatch.GetTimestamp();

    /// <summary>The recording of the current run, if one was started.</summary>
    public static StageTimes? Current => s_current.Value;

    /// <summary>Starts a recording for the calling flow and everything it starts from now on.</summary>
    public static StageTimes Start() => s_current.Value = new StageTimes();

    /// <summary>
    /// Adds the time until the returned scope is disposed to <paramref name="stage"/> of the current
    /// recording (null, and nothing measured, when none was started). Inside another stage the time
    /// stays with the outer one (the alignments a check runs are checking time), except for a part
    /// of it that is reported on its own, such as the ensemble of an alignment.
    /// </summary>
    public static IDisposable? Measure(string stage)
    {
        if (s_current.Value is not { } times) return null;
        var outer = Scope.Open;
        if (outer is not null && !Parts.Contains((outer.Stage, stage))) return null;
        return new Scope(times, stage, outer);
    }

    /// <summary>Runs <paramref name="work"/> as (part of) <paramref name="stage"/>.</summary>
    public static T Measure<T>(string stage, Func<T> work)
    {
        using (Measure(stage)) return work();
    }

    /// <summary>Seconds since the recording started.</summary>
    public double WallSeconds => Stopwatch.GetElapsedTime(_started).TotalSeconds;

    /// <summary>Seconds per stage measured so far, in pipeline order.</summary>
    public IReadOnlyList<(string Stage, double Seconds)> Snapshot()
    {
        lock (_ticks)
            return _ticks.OrderBy(t => Rank(t.Key)).ThenBy(t => t.Key, StringComparer.Ordinal)
                .Select(t => (t.Key, (double)t.Value / Stopwatch.Frequency)).ToList();
    }

    private static int Rank(string stage)
    {
        int k = Array.IndexOf(Order, stage);
        return k < 0 ? int.MaxValue : k;
    }

    private void Add(string stage, long ticks)
    {
        lock (_ticks) _ticks[stage] = _ticks.GetValueOrDefault(stage) + ticks;
    }

    private sealed class Scope : IDisposable
    {
        private static readonly AsyncLocal<Scope?> s_open = new();
        private readonly StageTimes _times;
        private readonly Scope? _outer;
        private readonly long _start = Stopwatch.GetTimestamp();
        private long _parts;

        public Scope(StageTimes times, string stage, Scope? outer)
        {
            _times = times;
            Stage = stage;
            _outer = outer;
            s_open.Value = this;
        }

        /// <summary>The innermost stage open on the calling flow.</summary>
        public static Scope? Open => s_open.Value;

        public string Stage { get; }

        public void Dispose()
        {
            long elapsed = Stopwatch.GetTimestamp() - _start;
            _times.Add(Stage, elapsed - _parts);
            if (_outer is not null) _outer._parts += elapsed;
            s_open.Value = _outer;
        }
    }
}
