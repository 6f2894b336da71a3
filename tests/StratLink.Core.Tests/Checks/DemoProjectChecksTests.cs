using StratLink.Checks;
using StratLink.Tests.TestSupport;
using StratLink.Workflows;
using Xunit.Abstractions;

namespace StratLink.Tests.Checks;

/// <summary>The committed demo site, consistent by construction, passes every check without an error.</summary>
public sealed class DemoProjectChecksTests(ITestOutputHelper output)
{
    [Fact]
    public void DemoProjectPassesTheChecksWithoutErrors()
    {
        var project = ProjectLoader.Load(Path.Combine(RepoPaths.DemoDirectory, "mirrowick-fjord.stratlink.yaml"));

        // What `stratlink check` shows: the loader's problems, the alignment's findings and the checks.
        var findings = CheckWorkflow.Run(project, null, CancellationToken.None);

        foreach (var f in findings) output.WriteLine(f.ToString());
        Assert.DoesNotContain(findings, f => f.Severity == Severity.Error);
        // Every check that needs the aligner ran: the loop over the four cores was closed and reported.
        Assert.DoesNotContain(findings, f => f.Code == CheckCodes.CheckNotRun);
        Assert.Contains(findings, f => f.Code == CheckCodes.LoopClosure);
    }
}
