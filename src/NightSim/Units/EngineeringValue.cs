using System.Globalization;

namespace NightSim.Units;

/// <summary>
/// Parses and prints values in engineering notation ("4k7", "100n", "2.2M", "3300uF", "12V", "1.5e-3").
/// The only place in the engine where SI prefixes exist; everything inside is plain SI.
/// </summary>
/// <remarks>
/// Prefix letters follow the SI brochure (BIPM, 9th edition, table 7): T G M k m u/µ n p f, where "m" is milli and
/// "M" is mega. "u" and "µ" are both micro. "k" and "K" are both kilo (the upper-case form is common practice on parts
/// lists). A letter between digits stands for the decimal point ("4k7" = 4.7e3, "2R2" = 2.2, common practice on
/// resistor markings, IEC 60062 letter code). A trailing unit symbol is allowed and checked against the expected unit.
/// "%" scales by 0.01 on dimensionless values ("5%" = 0.05). Where seconds are expected, "min" (60 s) and "h"
/// (3600 s) are accepted as well. "meg" is rejected as ambiguous (m is milli); so is a decimal point together with a
/// letter used as the decimal point ("1.5k7").
/// </remarks>
public static class EngineeringValue
{
    private static readonly (string Symbol, double Factor)[] s_prefixes =
    [
        ("T", 1e12), ("G", 1e9), ("M", 1e6), ("k", 1e3), ("K", 1e3),
        ("m", 1e-3), ("u", 1e-6), ("µ", 1e-6), ("μ", 1e-6), ("n", 1e-9), ("p", 1e-12), ("f", 1e-15),
    ];

    private static readonly (string Symbol, double Factor)[] s_printPrefixes =
    [
        ("T", 1e12), ("G", 1e9), ("M", 1e6), ("k", 1e3), ("", 1), ("m", 1e-3), ("µ", 1e-6), ("n", 1e-9), ("p", 1e-12), ("f", 1e-15),
    ];

    private const string PrefixList = "T G M k m u µ n p f (m is milli, M is mega)";

    /// <summary>Unit symbols the parser accepts after a value when no particular unit is expected.</summary>
    public static readonly IReadOnlyList<string> KnownUnits =
        ["V", "A", "Ω", "Ohm", "ohm", "R", "F", "H", "W", "Hz", "s", "lx", "S", "J", "Wh", "°C", "C", "K", "%", "cd", "deg", "°"];

    /// <summary>Parses <paramref name="text"/>; on failure <paramref name="error"/> says why and gives a hint
    /// ("message; hint").</summary>
    /// <param name="text">The value as written, e.g. "4k7" or "100nF".</param>
    /// <param name="expectedUnit">Unit symbol the value may carry ("F", "Ω", …), "" for a dimensionless value (only
    /// "%" allowed), or null to accept any known unit.</param>
    public static bool TryParse(string? text, string? expectedUnit, out double value, out string? error)
    {
        bool ok = TryParse(text, expectedUnit, out value, out EngineeringValueError? e);
        error = e?.ToString();
        return ok;
    }

    /// <summary>Parses <paramref name="text"/>; on failure <paramref name="error"/> holds the message and a separate hint.</summary>
    public static bool TryParse(string? text, string? expectedUnit, out double value, out EngineeringValueError? error)
    {
        value = double.NaN;
        error = null;
        if (string.IsNullOrWhiteSpace(text))
        {
            error = new("empty value", "write a number such as \"4k7\", \"100n\" or \"12\"");
            return false;
        }

        string s = text.Trim().Replace(" ", "", StringComparison.Ordinal);
        string bare = s.TrimStart('+');
        if (bare.Equals("inf", StringComparison.OrdinalIgnoreCase) || bare.Equals("infinity", StringComparison.OrdinalIgnoreCase)
            || bare == "∞")
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
            error = s.StartsWith('R') || s.StartsWith('r')
                ? new($"\"{text}\" does not start with a number", $"write a leading zero, e.g. \"0R47\" or \"0.47\"")
                : new($"\"{text}\" does not start with a number", "write e.g. \"4k7\", \"100n\" or \"2.2M\"");
            return false;
        }
        // Exponent only if followed by a digit (so "1e-3" works but "1E" is not eaten).
        bool hasExponent = false;
        if (i < s.Length && (s[i] == 'e' || s[i] == 'E'))
        {
            int j = i + 1;
            if (j < s.Length && (s[j] == '+' || s[j] == '-')) j++;
            if (j < s.Length && char.IsAsciiDigit(s[j]))
            {
                while (j < s.Length && char.IsAsciiDigit(s[j])) j++;
                i = j;
                hasExponent = true;
            }
        }
        string number = s[..i];
        string rest = s[i..];
        if (!double.TryParse(number, NumberStyles.Float, CultureInfo.InvariantCulture, out double mantissa)
            || number.Count(c => c == '.') > 1)
        {
            error = new($"\"{text}\" is not a number", "use one decimal point, e.g. \"2.2M\"");
            return false;
        }
        if (rest.StartsWith(','))
        {
            error = new($"\"{text}\" uses a decimal comma", "use a decimal point (\"4.7k\") or the prefix as the point (\"4k7\")");
            return false;
        }

        // "meg"/"Meg" is not accepted: it is ambiguous next to "m" = milli; say so.
        if (rest.StartsWith("meg", StringComparison.OrdinalIgnoreCase))
        {
            error = new($"\"{text}\": \"{rest[..3]}\" is ambiguous", "use \"M\" for mega (m is milli), e.g. \"2.2M\"");
            return false;
        }

        // Prefix letter used as the decimal point: "4k7", "2R2", "1M5".
        if (rest.Length >= 2 && !hasExponent)
        {
            string letter = rest[..1];
            int k = 1;
            while (k < rest.Length && char.IsAsciiDigit(rest[k])) k++;
            if (k > 1 && (letter == "R" || FindPrefix(letter) is not null))
            {
                if (number.Contains('.'))
                {
                    error = new($"\"{text}\" is ambiguous: it has both a decimal point and \"{letter}\" as a decimal point",
                        $"write either \"{number}{letter}\" or \"{number.Split('.')[0]}{letter}{rest[1..k]}\"");
                    return false;
                }
                mantissa = double.Parse(number + "." + rest[1..k], CultureInfo.InvariantCulture);
                double factor = letter == "R" ? 1.0 : FindPrefix(letter)!.Value;
                return FinishUnit(text, rest[k..], expectedUnit, mantissa * factor, out value, out error);
            }
        }

        if (rest.Length == 0)
        {
            value = mantissa;
            return true;
        }

        // Whole rest is a unit (e.g. "12V", "3Hz", "10lx", "2h") — try that before reading a prefix,
        // so that "2F" is farads, not femto.
        if (UnitFactor(rest, expectedUnit) is { } whole)
        {
            value = mantissa * whole;
            return true;
        }

        if (expectedUnit is not null && FindPrefix(rest) is null && (KnownUnits.Contains(rest) || rest is "ohms" or "min" or "h"))
        {
            return FinishUnit(text, rest, expectedUnit, mantissa, out value, out error);
        }

        double? prefix = FindPrefix(rest[..1]);
        if (prefix is null)
        {
            error = new($"\"{text}\": unknown suffix \"{rest}\"", $"prefixes are {PrefixList}" + UnitHint(expectedUnit));
            return false;
        }
        return FinishUnit(text, rest[1..], expectedUnit, mantissa * prefix.Value, out value, out error);
    }

    /// <summary>Parses or throws <see cref="FormatException"/> with the hint.</summary>
    public static double Parse(string text, string? expectedUnit = null)
        => TryParse(text, expectedUnit, out double v, out EngineeringValueError? e) ? v : throw new FormatException(e!.ToString());

    /// <summary>Prints <paramref name="value"/> (SI) with an engineering prefix and the unit, e.g. 4700 → "4.7 kΩ".
    /// Seconds of a minute or more print as "min" or "h" (5400 s → "1.5 h"); dimensionless values (unit "") and values
    /// beyond the prefix table print plainly (0.05 → "0.05", 1e18 Ω → "1e+18 Ω").</summary>
    /// <param name="digits">Significant digits (default 4).</param>
    public static string Format(double value, string unit = "", int digits = 4)
    {
        string unitPart = unit.Length > 0 ? " " + unit : "";
        if (double.IsNaN(value)) return "NaN";
        if (double.IsInfinity(value)) return (value > 0 ? "∞" : "-∞") + unitPart;
        if (value == 0) return "0" + unitPart;
        double abs = Math.Abs(value);
        if (unit.Length == 0 || abs >= 999.95e12 || abs < 1e-15)
        {
            // Dimensionless values (fractions, ratios) and values beyond the prefix table print plainly.
            return value.ToString("G" + digits, CultureInfo.InvariantCulture).Replace("E", "e", StringComparison.Ordinal) + unitPart;
        }
        if (unit == "s" && abs >= 59.9995)
        {
            // Long durations read better in minutes and hours than in kiloseconds (SI brochure, table 8).
            return abs >= 3600
                ? (value / 3600).ToString("G" + digits, CultureInfo.InvariantCulture) + " h"
                : (value / 60).ToString("G" + digits, CultureInfo.InvariantCulture) + " min";
        }
        (string sym, double f) = s_printPrefixes[^1];
        foreach ((string Symbol, double Factor) p in s_printPrefixes)
        {
            // Round first so 999.99 with 4 digits prints "1 k", not "1000".
            double rounded = double.Parse((abs / p.Factor).ToString("G" + digits, CultureInfo.InvariantCulture), CultureInfo.InvariantCulture);
            if (rounded >= 1)
            {
                (sym, f) = p;
                break;
            }
        }
        string num = (value / f).ToString("G" + digits, CultureInfo.InvariantCulture);
        if (num.Contains('E')) num = value.ToString("G" + digits, CultureInfo.InvariantCulture);
        string suffix = sym + unit;
        return suffix.Length > 0 ? num + " " + suffix : num;
    }

    private static string UnitHint(string? expectedUnit) => expectedUnit switch
    {
        null => "",
        "" => "; this value has no unit (\"%\" is allowed)",
        "s" => "; unit s (also min, h)",
        _ => $"; unit {expectedUnit}",
    };

    private static bool FinishUnit(string text, string rest, string? expectedUnit, double v, out double value, out EngineeringValueError? error)
    {
        value = double.NaN;
        error = null;
        if (rest.Length == 0)
        {
            value = v;
            return true;
        }
        if (UnitFactor(rest, expectedUnit) is { } factor)
        {
            value = v * factor;
            return true;
        }
        error = expectedUnit switch
        {
            null => new($"\"{text}\": unknown unit \"{rest}\"", "units are " + string.Join(" ", KnownUnits)),
            "" => new($"\"{text}\": unit \"{rest}\" does not fit", "this value has no unit; write a plain number or a percentage"),
            _ => new($"\"{text}\": unit \"{rest}\" does not fit", $"expected {expectedUnit}{(expectedUnit == "s" ? " (or min, h)" : "")}"),
        };
        return false;
    }

    /// <summary>Scale factor of a unit suffix that fits <paramref name="expectedUnit"/>, or null when it does not.</summary>
    private static double? UnitFactor(string s, string? expectedUnit)
    {
        if (s == "%") return expectedUnit is null or "" or "%" ? 0.01 : null;
        if (expectedUnit is null)
        {
            foreach (string u in KnownUnits)
            {
                if (s == u) return 1.0;
            }
            return null;
        }
        if (s == expectedUnit) return 1.0;
        return expectedUnit switch
        {
            "Ω" or "Ohm" or "ohm" => s is "Ω" or "Ohm" or "ohm" or "ohms" or "R" ? 1.0 : null,
            "°" or "deg" => s is "°" or "deg" ? 1.0 : null,
            "s" => s switch { "min" => 60.0, "h" => 3600.0, _ => null },
            _ => null,
        };
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
