using System.Globalization;

namespace NightSim.Units;

/// <summary>
/// Parses and prints values in engineering notation ("4k7", "100n", "2.2M", "3300uF", "12V", "1.5e-3").
/// The only place in the engine where SI prefixes exist; everything inside is plain SI.
/// </summary>
/// <remarks>
/// Prefix letters follow the SI brochure (BIPM, 9th edition, table 7): "m" is milli and "M" is mega.
/// "u" and "µ" are both micro. "k" and "K" are both kilo (the upper-case form is common practice on parts lists).
/// A letter between digits stands for the decimal point ("4k7" = 4.7e3, "2R2" = 2.2, common practice on
/// resistor markings). A trailing unit symbol is allowed and checked against the expected unit when one is given.
/// </remarks>
public static class EngineeringValue
{
    private static readonly (string Symbol, double Factor)[] s_prefixes =
    [
        ("T", 1e12), ("G", 1e9), ("M", 1e6), ("k", 1e3), ("K", 1e3),
        ("m", 1e-3), ("u", 1e-6), ("µ", 1e-6), ("μ", 1e-6), ("n", 1e-9), ("p", 1e-12), ("f", 1e-15),
    ];

    /// <summary>Unit symbols the parser accepts after a value.</summary>
    public static readonly IReadOnlyList<string> KnownUnits =
        ["V", "A", "Ω", "Ohm", "ohm", "R", "F", "H", "W", "Hz", "s", "lx", "S", "J", "Wh", "°C", "C", "K", "%", "cd", "deg", "°"];

    /// <summary>Parses <paramref name="text"/>; on failure <paramref name="error"/> says why and gives a hint.</summary>
    /// <param name="text">The value as written, e.g. "4k7" or "100nF".</param>
    /// <param name="expectedUnit">Unit symbol the value may carry ("F", "Ω", …), or null to accept any known unit.</param>
    public static bool TryParse(string? text, string? expectedUnit, out double value, out string? error)
    {
        value = double.NaN;
        error = null;
        if (string.IsNullOrWhiteSpace(text))
        {
            error = "empty value; write a number such as \"4k7\", \"100n\" or \"12\"";
            return false;
        }

        string s = text.Trim().Replace(" ", "", StringComparison.Ordinal);
        if (s.Equals("inf", StringComparison.OrdinalIgnoreCase) || s.Equals("infinity", StringComparison.OrdinalIgnoreCase))
        {
            value = double.PositiveInfinity;
            return true;
        }

        // Leading number: sign, digits, one decimal point, optional exponent.
        int i = 0;
        if (i < s.Length && (s[i] == '+' || s[i] == '-')) i++;
        int digitsStart = i;
        while (i < s.Length && (char.IsAsciiDigit(s[i]) || s[i] == '.')) i++;
        if (i == digitsStart)
        {
            error = $"\"{text}\" does not start with a number; write e.g. \"4k7\", \"100n\" or \"2.2M\"";
            return false;
        }
        // Exponent only if followed by a digit (so "1e-3" works but "1E" is not eaten).
        if (i < s.Length && (s[i] == 'e' || s[i] == 'E'))
        {
            int j = i + 1;
            if (j < s.Length && (s[j] == '+' || s[j] == '-')) j++;
            if (j < s.Length && char.IsAsciiDigit(s[j]))
            {
                while (j < s.Length && char.IsAsciiDigit(s[j])) j++;
                i = j;
            }
        }
        string number = s[..i];
        string rest = s[i..];
        if (!double.TryParse(number, NumberStyles.Float, CultureInfo.InvariantCulture, out double mantissa))
        {
            error = $"\"{text}\" is not a number";
            return false;
        }

        double factor = 1.0;
        // Prefix letter used as the decimal point: "4k7", "2R2", "1M5".
        if (rest.Length >= 2 && !number.Contains('.') && !number.Contains('e') && !number.Contains('E'))
        {
            string letter = rest[..1];
            int k = 1;
            while (k < rest.Length && char.IsAsciiDigit(rest[k])) k++;
            if (k > 1 && (letter == "R" || FindPrefix(letter) is not null))
            {
                string frac = rest[1..k];
                mantissa = double.Parse(number + "." + frac, CultureInfo.InvariantCulture);
                factor = letter == "R" ? 1.0 : FindPrefix(letter)!.Value;
                rest = rest[k..];
                return FinishUnit(text, rest, expectedUnit, mantissa * factor, out value, out error);
            }
        }

        if (rest.Length == 0)
        {
            value = mantissa;
            return true;
        }

        // Whole rest is a unit (e.g. "12V", "3Hz", "10lx") — try that before reading a prefix,
        // so that "2F" is farads, not femto.
        if (IsUnit(rest, expectedUnit))
        {
            value = mantissa;
            return true;
        }

        // "meg"/"Meg" is not accepted: it is ambiguous next to "m" = milli; say so.
        if (rest.StartsWith("meg", StringComparison.OrdinalIgnoreCase))
        {
            error = $"\"{text}\": use \"M\" for mega (m is milli); write e.g. \"2.2M\"";
            return false;
        }

        double? prefix = FindPrefix(rest[..1]);
        if (prefix is null)
        {
            error = $"\"{text}\": unknown suffix \"{rest}\"; prefixes are T G M k m u µ n p f (m is milli, M is mega)"
                + (expectedUnit is null ? "" : $", unit {expectedUnit}");
            return false;
        }
        return FinishUnit(text, rest[1..], expectedUnit, mantissa * prefix.Value, out value, out error);
    }

    /// <summary>Parses or throws <see cref="FormatException"/> with the hint.</summary>
    public static double Parse(string text, string? expectedUnit = null)
        => TryParse(text, expectedUnit, out double v, out string? e) ? v : throw new FormatException(e);

    /// <summary>Prints <paramref name="value"/> (SI) with an engineering prefix and the unit, e.g. 4700 → "4.7 kΩ".</summary>
    /// <param name="digits">Significant digits (default 4).</param>
    public static string Format(double value, string unit = "", int digits = 4)
    {
        if (double.IsNaN(value)) return "NaN";
        if (double.IsInfinity(value)) return (value > 0 ? "∞" : "-∞") + (unit.Length > 0 ? " " + unit : "");
        if (value == 0) return "0" + (unit.Length > 0 ? " " + unit : "");
        double abs = Math.Abs(value);
        (string Symbol, double Factor)[] order =
            [("T", 1e12), ("G", 1e9), ("M", 1e6), ("k", 1e3), ("", 1), ("m", 1e-3), ("µ", 1e-6), ("n", 1e-9), ("p", 1e-12), ("f", 1e-15)];
        (string sym, double f) = order[^1];
        foreach ((string Symbol, double Factor) p in order)
        {
            if (abs >= p.Factor * 0.99995)
            {
                (sym, f) = p;
                break;
            }
        }
        double scaled = value / f;
        string num = scaled.ToString("G" + digits, CultureInfo.InvariantCulture);
        string suffix = sym + unit;
        return suffix.Length > 0 ? num + " " + suffix : num;
    }

    private static bool FinishUnit(string text, string rest, string? expectedUnit, double v, out double value, out string? error)
    {
        value = double.NaN;
        error = null;
        if (rest.Length == 0 || IsUnit(rest, expectedUnit))
        {
            value = v;
            return true;
        }
        error = expectedUnit is null
            ? $"\"{text}\": unknown unit \"{rest}\""
            : $"\"{text}\": unit \"{rest}\" does not fit; expected {expectedUnit}";
        return false;
    }

    private static bool IsUnit(string s, string? expectedUnit)
    {
        if (expectedUnit is not null)
        {
            if (s == expectedUnit) return true;
            bool ohms = expectedUnit is "Ω" or "Ohm" or "ohm";
            return ohms && s is "Ω" or "Ohm" or "ohm" or "ohms" or "R";
        }
        foreach (string u in KnownUnits)
        {
            if (s == u) return true;
        }
        return false;
    }

    private static double? FindPrefix(string symbol)
    {
        foreach ((string Symbol, double Factor) p in s_prefixes)
        {
            if (p.Symbol == symbol) return p.Factor;
        }
        return null;
    }
}
