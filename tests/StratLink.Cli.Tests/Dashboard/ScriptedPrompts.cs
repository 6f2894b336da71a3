using StratLink.Cli.Dashboard.Dialogs;

namespace StratLink.Tests.Dashboard;

/// <summary>Answers the dashboard's questions from a script and records what was asked.</summary>
internal sealed class ScriptedPrompts : IPrompts
{
    public Queue<string?> Texts { get; } = new();
    public Queue<int?> Choices { get; } = new();
    public List<string> Asked { get; } = [];
    public List<IReadOnlyList<string>> Shown { get; } = [];

    public string? AskText(string title, string label, string initial)
    {
        Asked.Add(title);
        return Texts.Count > 0 ? Texts.Dequeue() : null;
    }

    public int? Choose(string title, string message, IReadOnlyList<string> options, int initial = 0)
    {
        Asked.Add(title);
        return Choices.Count > 0 ? Choices.Dequeue() : null;
    }

    public void ShowText(string title, IReadOnlyList<string> lines)
    {
        Asked.Add(title);
        Shown.Add(lines);
    }
}
