using System.Runtime.CompilerServices;

namespace StratLink.Tests.Dashboard;

internal static class TerminalGuiSetup
{
    // Runs before any test: Terminal.Gui must not touch the real console (no raw mode, no
    // terminal queries, no stdin reads), or a test run inside a terminal stops on SIGTTOU.
    [ModuleInitializer]
    internal static void Init() => Environment.SetEnvironmentVariable("DisableRealDriverIO", "1");
}

// Terminal.Gui keeps process-wide statics (default key bindings, configuration), so UI tests run one at a time.
[CollectionDefinition("TerminalGui", DisableParallelization = true)]
public sealed class TerminalGuiCollection;
