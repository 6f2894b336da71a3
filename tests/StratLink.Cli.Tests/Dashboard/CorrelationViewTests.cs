using StratLink.Cli.Dashboard;
using StratLink.Cli.Dashboard.Drawing;
using Xunit.Abstractions;

namespace StratLink.Tests.Dashboard;

[Collection("TerminalGui")]
public sealed class CorrelationViewTests(ITestOutputHelper output)
{
    [Fact]
    public void Draws_two_logs_with_header_and_keys_at_80x24()
    {
        using var project = new TestProject();
        using var h = new DashboardHarness(project);
        output.WriteLine(h.ScreenText);
        Assert.Contains("Testmere Basin", h.Row(0));
        Assert.Contains("testmere.yaml", h.Row(0));
        Assert.Contains("saved", h.Row(0));
        Assert.Contains("not run yet", h.Row(0));
        Assert.Contains("1 Logs", h.Row(1));
        Assert.Contains("T-1 · ms", h.Row(2));
        Assert.Contains("T-2 · ms", h.Row(2));
        Assert.StartsWith(" F1 Keys", h.Row(23));
        Assert.Contains("q Quit", h.Row(23));
    }
}
