using System.Globalization;

namespace NightSim.Units;

/// <summary>
/// Parses run durations: a number with a time unit — "10s", "500ms", "20us", "90min", "24h", "7d" — or a bare number of
/// seconds ("3600"). "m" alone is refused because it would be ambiguous between minutes and milli-.
/// </summary>
public static class Duration
{
    private static readonly (string Unit, double Seconds)[] s_units =
    [
        ("min", 60), ("ms", 1e-3), ("us", 1e-6), ("µs", 1e-6), ("μs", 1e-6), ("ns", 1e-9),
        ("s", 1), ("h", 3600), ("d", 86400),
    ];

    /// <summary>Parses <paramref name="text"/> into seconds; on failure <paramref name="error"/> says why.</summary>
    public static bool TryParse(string? text, out double seconds, out string? error)
    {
        seconds = double.NaN;
        error = null;
        string s = (text ?? "").Trim().Replace(" ", "", StringComparison.Ordinal);
        if (s.Length == 0)
        {
            error = "empty duration; write e.g. \"10s\", \"90min\" or \"24h\"";
            return false;
        }
        foreach (var (unit, factor) in s_units)
        {
            if (!s.EndsWith(unit, StringComparison.Ordinal)) continue;
            string number = s[..^unit.Length];
            if (double.TryParse(number, NumberStyles.Float, CultureInfo.InvariantCulture, out double v) && double.IsFinite(v))
            {
                return Check(v * factor, text!, out seconds, out error);
            }
            break;
        }
        if (double.TryParse(s, NumberStyles.Float, CultureInfo.InvariantCulture, out double bare) && double.IsFinite(bare))
            return Check(bare, text!, out seconds, out error);
        error = s.EndsWith('m')
            ? $"'{text}' is ambiguous; write \"{s[..^1]}min\" for minutes or \"{s[..^1]}ms\" for milliseconds"
            : $"'{text}' is not a duration; write a number with s, ms, us, min, h or d, e.g. \"10s\" or \"24h\"";
        return false;
    }

    /// <summary>Parses or throws <see cref="FormatException"/>.</summary>
    public static double Parse(string text) => TryParse(text, out double s, out string? e) ? s : throw new FormatException(e);

    private static bool Check(double v, string text, out double seconds, out string? error)
    {
        seconds = v;
        error = v > 0 ? null : $"duration '{text}' must be positive";
        return v > 0;
    }
}
