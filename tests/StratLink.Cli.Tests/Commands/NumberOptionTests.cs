using System.CommandLine;
using StratLink.Cli.Commands;

namespace StratLink.Tests.Commands;

/// <summary>
/// Number options read numbers as the project file does: invariant digits with a decimal point, or a
/// lone decimal comma as written in much of continental Europe (ISO 80000-1 allows either mark); a
/// comma before exactly three digits could be a thousands separator and is refused.
/// </summary>
public class NumberOptionTests
{
    private static (double Value, IReadOnlyList<string> Errors) Parse(string text)
    {
        var option = NumberOption.Create("--x", "a number");
        var root = new RootCommand { option };
        var result = root.Parse(["--x", text]);
        var errors = result.Errors.Select(e => e.Message).ToList();
        return (errors.Count == 0 ? result.GetValue(option) : double.NaN, errors);
    }

    [Theory]
    [InlineData("3000.5", 3000.5)]
    [InlineData("3000,5", 3000.5)]
    [InlineData("-0,25", -0.25)]
    [InlineData("1e3", 1000)]
    public void Reads_a_decimal_point_or_a_lone_decimal_comma(string text, double expected)
    {
        var (value, errors) = Parse(text);
        Assert.Empty(errors);
        Assert.Equal(expected, value, 1e-12);
    }

    [Theory]
    [InlineData("3,000", "ambiguous")]
    [InlineData("1,234,5", "not a number")]
    [InlineData("abc", "not a number")]
    [InlineData("NaN", "not a number")]
    public void Refuses_ambiguous_or_malformed_numbers_naming_the_option(string text, string reason)
    {
        var (_, errors) = Parse(text);
        string message = Assert.Single(errors);
        Assert.Contains("--x", message);
        Assert.Contains(reason, message);
    }

    [Fact]
    public void An_absent_option_takes_its_default()
    {
        var option = NumberOption.Create("--x", "a number", defaultValue: 2);
        var result = new RootCommand { option }.Parse([]);
        Assert.Empty(result.Errors);
        Assert.Equal(2, result.GetValue(option));
    }
}
