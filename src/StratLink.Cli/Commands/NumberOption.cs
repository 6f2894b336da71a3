using System.CommandLine;
using System.CommandLine.Parsing;
using System.Globalization;
using System.Text.RegularExpressions;

namespace StratLink.Cli.Commands;

/// <summary>
/// Number options read the way the project file reads numbers: invariant, with a lone decimal comma
/// (<c>1,5</c>) taken as a decimal mark. The toolkit's own parser allows thousands separators, so it
/// read <c>3000,5</c> as 30005; a comma followed by exactly three digits (<c>3,000</c>) could be
/// either and is refused with the option's name.
/// </summary>
internal static partial class NumberOption
{
    public static Option<double> Create(string name, string description, double defaultValue = 0, bool required = false)
    {
        var option = new Option<double>(name) { Description = description, Required = required, CustomParser = result => Parse(name, result) };
        if (!required) option.DefaultValueFactory = _ => defaultValue;
        return option;
    }

    private static double Parse(string name, ArgumentResult result)
    {
        string text = result.Tokens.Count == 1 ? result.Tokens[0].Value.Trim() : "";
        if (ThousandsLike().IsMatch(text))
        {
            result.AddError($"{name}: '{text}' is ambiguous (a decimal comma or a thousands separator); write it with a decimal point, e.g. {text.Replace(",", "")} or {text.Replace(',', '.')}.");
            return 0;
        }
        if (LoneDecimalComma().IsMatch(text)) text = text.Replace(',', '.');
        if (double.TryParse(text, NumberStyles.Float, CultureInfo.InvariantCulture, out double value) && double.IsFinite(value)) return value;
        result.AddError($"{name}: '{text}' is not a number.");
        return 0;
    }

    [GeneratedRegex(@"^[+-]?\d{1,3},\d{3}$")]
    private static partial Regex ThousandsLike();

    [GeneratedRegex(@"^[+-]?\d+,\d+$")]
    private static partial Regex LoneDecimalComma();
}
