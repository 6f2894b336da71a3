using StratLink.Cli.Dashboard;
using StratLink.Cli.Dashboard.Views;
using Terminal.Gui.App;
using Terminal.Gui.Input;
using Terminal.Gui.Testing;

namespace StratLink.Tests.Dashboard;

/// <summary>Tests that need the main loop (background runs, quitting): Run with a watchdog.</summary>
[Collection("TerminalGui")]
public sealed class RunAndQuitTests
{
    private static bool RunUntil(DashboardHarness h, Func<int, bool> step) => h.RunUntil(step);

    [Fact]
    public void A_cancelled_run_leaves_the_results_as_they_were()
    {
        using var project = new TestProject();
        using var h = new DashboardHarness(project, begin: false);
        h.Workflows.BlockUntilCancelled = true;
        int phase = 0;
        bool sawProgress = false;
        bool finished = RunUntil(h, _ =>
        {
            switch (phase)
            {
                case 0:
                    h.App.InjectKey(new Key('r'));
                    phase = 1;
                    return false;
                case 1:
                    if (!h.Workflows.Started.IsSet) return false;
                    sawProgress |= h.Window.RunInProgress;
                    h.App.InjectKey(new Key('x'));
                    phase = 2;
                    return false;
                default:
                    return !h.Window.RunInProgress;
            }
        });
        Assert.True(finished, "the run did not stop");
        Assert.True(sawProgress);
        Assert.True(h.Workflows.SawCancellation);
        Assert.Null(h.State.Results);
        Assert.Equal(ResultsState.NotRun, h.State.ResultsState);
        Assert.Contains("Run stopped", h.Window.Message);
    }

    [Fact]
    public void A_complete_run_replaces_the_results_and_an_edit_makes_them_stale()
    {
        using var project = new TestProject();
        using var h = new DashboardHarness(project, begin: false);
        h.Workflows.Results = TestResults.Full;
        bool sent = false;
        bool finished = RunUntil(h, _ =>
        {
            if (!sent) { h.App.InjectKey(new Key('r')); sent = true; return false; }
            return h.State.Results is not null && !h.Window.RunInProgress;
        });
        Assert.True(finished);
        Assert.Equal(ResultsState.Current, h.State.ResultsState);
        Assert.Contains("Run finished", h.Window.Message);
        h.Window.Execute(StratLink.Cli.Dashboard.Keys.DashCommand.AddTie);
        Assert.Equal(ResultsState.Stale, h.State.ResultsState);
        h.Window.Execute(StratLink.Cli.Dashboard.Keys.DashCommand.Undo);
        Assert.Equal(ResultsState.Current, h.State.ResultsState);
    }

    [Fact]
    public void Esc_does_not_quit_but_q_does()
    {
        using var project = new TestProject();
        using var h = new DashboardHarness(project, begin: false);
        int step = 0;
        bool stillRunningAfterEsc = false;
        bool stopped = false;
        h.Window.IsRunningChanged += (_, e) => { if (!e.Value) stopped = true; };
        bool finished = RunUntil(h, _ =>
        {
            switch (step++)
            {
                case 0: h.App.InjectKey(Key.Esc); return false;
                case 1: stillRunningAfterEsc = !stopped; h.App.InjectKey(new Key('q')); return false;
                default: return stopped;
            }
        });
        Assert.True(finished, "q did not quit");
        Assert.True(stillRunningAfterEsc);
    }

    [Fact]
    public void Quit_with_unsaved_edits_asks_and_stay_keeps_the_window()
    {
        using var project = new TestProject();
        using var h = new DashboardHarness(project);
        h.Type("t");
        h.Prompts.Choices.Enqueue(2);
        h.Type("q");
        Assert.Contains("Quit", h.Prompts.Asked);
        Assert.False(h.Window.StopRequested);
        Assert.True(File.Exists(h.Recovery.FilePath));
        h.Prompts.Choices.Enqueue(1);
        h.Type("q");
        Assert.True(h.Window.StopRequested);
        Assert.False(File.Exists(h.Recovery.FilePath));
    }
}
