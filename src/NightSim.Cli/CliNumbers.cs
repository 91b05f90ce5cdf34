using System.CommandLine;
using System.CommandLine.Parsing;
using System.Globalization;

namespace NightSim.Cli;

/// <summary>
/// Numeric options read the same in every language setting (a decimal point, never a comma); a value that is not a
/// number, not finite or out of range is a command-line mistake (exit 1) with a message that names the option.
/// </summary>
internal static class CliNumbers
{
    /// <summary>An option holding a finite real number in [<paramref name="min"/>, <paramref name="max"/>].</summary>
    public static Option<double> Real(string name, string description, double min, double max, string example)
    {
        var option = new Option<double>(name) { Description = description };
        option.CustomParser = r => ParseReal(r, name, min, max, example);
        return option;
    }

    /// <summary>An option holding a whole number in [<paramref name="min"/>, <paramref name="max"/>].</summary>
    public static Option<T> Whole<T>(string name, string description, int min, int max, string unit, params string[] aliases)
    {
        var option = new Option<T>(name, aliases) { Description = description };
        option.CustomParser = r => (T)(object)ParseWhole(r, name, min, max, unit);
        return option;
    }

    private static double ParseReal(ArgumentResult r, string name, double min, double max, string example)
    {
        string text = r.Tokens.Count > 0 ? r.Tokens[0].Value.Trim() : "";
        string? problem = RealProblem(text, min, max, example, out double value);
        if (problem is not null) r.AddError($"{name}: {problem}");
        return value;
    }

    /// <summary>Null when <paramref name="text"/> is a finite number in range, else what is wrong with a hint.</summary>
    internal static string? RealProblem(string text, double min, double max, string example, out double value)
    {
        var inv = CultureInfo.InvariantCulture;
        if (DecimalComma(text))
        {
            value = 0;
            return $"\"{Clip(text)}\" has a decimal comma. hint: write a decimal point, e.g. {example}";
        }
        if (!double.TryParse(text, NumberStyles.Float, inv, out value))
            return $"\"{Clip(text)}\" is not a number. hint: write e.g. {example}";
        if (!double.IsFinite(value))
            return $"\"{Clip(text)}\" is not a finite number. hint: write e.g. {example}";
        if (value < min || value > max)
            return string.Create(inv, $"{value} is outside {min}…{max}. hint: write e.g. {example}");
        return null;
    }

    private static int ParseWhole(ArgumentResult r, string name, int min, int max, string unit)
    {
        string text = r.Tokens.Count > 0 ? r.Tokens[0].Value.Trim() : "";
        var inv = CultureInfo.InvariantCulture;
        if (!int.TryParse(text, NumberStyles.AllowLeadingSign, inv, out int value))
        {
            r.AddError(string.Create(inv, $"{name}: \"{Clip(text)}\" is not a whole number. hint: give {min} to {max} {unit}"));
            return min;
        }
        if (value < min || value > max)
        {
            r.AddError(string.Create(inv, $"{name}: {value} is out of range. hint: give {min} to {max} {unit}"));
            return min;
        }
        return value;
    }

    /// <summary>"8,6" or "1,5k": digits on both sides of a comma and no decimal point.</summary>
    internal static bool DecimalComma(string text)
    {
        int c = text.IndexOf(',');
        return c > 0 && c < text.Length - 1 && !text.Contains('.') && char.IsAsciiDigit(text[c - 1]) && char.IsAsciiDigit(text[c + 1]);
    }

    /// <summary>Long text echoed in a message is cut to its first 40 characters.</summary>
    internal static string Clip(string text) => text.Length <= 40 ? text : text[..40] + "…";
}
