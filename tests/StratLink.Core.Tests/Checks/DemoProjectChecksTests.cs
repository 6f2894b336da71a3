using StratLink.Alignment;
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
        Assert.False(project.Problems.HasErrors, string.Join("\n", project.Problems));
        var alignment = CoreAligner.Align(project, null, CancellationToken.None);
        var ctx = new CheckContext { Aligner = (p, ct) => CoreAligner.Align(p, null, ct) };

        var findings = ProjectChecks.Run(project, alignment, ctx, CancellationToken.None);

        foreach (var f in findings) output.WriteLine(f.ToString());
        Assert.DoesNotContain(findings, f => f.Severity == Severity.Error);
        // Every check that needs the aligner ran: the loop over the four cores was closed and reported.
        Assert.DoesNotContain(findings, f => f.Code == CheckCodes.CheckNotRun);
        Assert.Contains(findings, f => f.Code == CheckCodes.LoopClosure);
    }
}
