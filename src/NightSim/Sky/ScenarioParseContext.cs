using System.Globalization;
using System.Text.Json;
using NightSim.Units;

namespace NightSim.Sky;

/// <summary>
/// Helpers for reading one scenario document: typed property access that records every problem (file, line:column,
/// JSON path, hint) instead of stopping at the first. Used by the loader and by light-event definitions.
/// </summary>
public sealed class ScenarioParseContext
{
    private readonly List<ScenarioError> _errors = [];
    private readonly JsonLocator? _locator;

    public ScenarioParseContext(string fileName, JsonLocator? locator = null, string? baseDirectory = null)
    {
        FileName = fileName;
        _locator = locator;
        BaseDirectory = baseDirectory ?? Directory.GetCurrentDirectory();
    }

    /// <summary>File name used in messages.</summary>
    public string FileName { get; }
    /// <summary>Directory that relative file references (light logs) resolve against.</summary>
    public string BaseDirectory { get; }
    /// <summary>All problems so far.</summary>
    public IReadOnlyList<ScenarioError> Errors => _errors;

    /// <summary>Records a problem at <paramref name="path"/>.</summary>
    public void Error(string path, string message, string? hint = null)
    {
        var (line, column) = _locator?.Find(path) ?? (0, 0);
        _errors.Add(new ScenarioError(FileName, path, message, hint, line, column));
    }

    /// <summary>Adds problems found elsewhere (e.g. in a light-log file).</summary>
    public void AddRange(IEnumerable<ScenarioError> errors) => _errors.AddRange(errors);

    /// <summary>Reports properties of <paramref name="obj"/> not in <paramref name="allowed"/> (catches typos).</summary>
    public void CheckProperties(JsonElement obj, string path, params string[] allowed)
    {
        if (obj.ValueKind != JsonValueKind.Object) return;
        foreach (JsonProperty p in obj.EnumerateObject())
        {
            if (Array.IndexOf(allowed, p.Name) >= 0) continue;
            string? near = allowed.FirstOrDefault(a => string.Equals(a, p.Name, StringComparison.OrdinalIgnoreCase))
                ?? allowed.Where(a => EditDistance(a, p.Name) <= 2).OrderBy(a => EditDistance(a, p.Name)).FirstOrDefault();
            Error($"{path}.{p.Name}", $"unknown property \"{p.Name}\"",
                near is not null ? $"did you mean \"{near}\"?" : $"allowed here: {string.Join(", ", allowed)}");
        }
    }

    /// <summary>True when <paramref name="obj"/> is an object; otherwise records an error.</summary>
    public bool ExpectObject(JsonElement obj, string path)
    {
        if (obj.ValueKind == JsonValueKind.Object) return true;
        Error(path, $"expected an object, found {Describe(obj)}", "write { … }");
        return false;
    }

    /// <summary>A number property; JSON numbers or engineering strings ("4k7", "2.5lx", "300u"). Null when absent or bad.</summary>
    public double? Number(JsonElement obj, string path, string name, string? unit = null, bool required = false,
        double? min = null, double? max = null, bool minExclusive = false)
    {
        string p = $"{path}.{name}";
        if (!obj.TryGetProperty(name, out JsonElement v))
        {
            if (required) Error(path, $"missing required property \"{name}\"", unit is null ? "add it as a number" : $"add it as a value in {unit}");
            return null;
        }
        double value;
        if (v.ValueKind == JsonValueKind.Number)
        {
            if (!v.TryGetDouble(out value) || !double.IsFinite(value))
            {
                Error(p, $"{Clip(v.GetRawText())} is too large to be a number (beyond ±1.8e308)", "check the exponent");
                return null;
            }
        }
        else if (v.ValueKind == JsonValueKind.String)
        {
            if (!EngineeringValue.TryParse(v.GetString(), unit, out value, out string? err))
            {
                Error(p, err ?? "not a number", "write a number such as 2.5 or an engineering value such as \"300u\"");
                return null;
            }
        }
        else
        {
            Error(p, $"expected a number, found {Describe(v)}", "write a number such as 2.5 or an engineering value such as \"300u\"");
            return null;
        }
        if (!double.IsFinite(value)) { Error(p, "the value must be finite", "write an ordinary number"); return null; }
        if (min is double lo && (value < lo || (minExclusive && value == lo)))
        {
            Error(p, $"{F(value)} is too small", minExclusive ? $"must be greater than {F(lo)}" : $"must be at least {F(lo)}");
            return null;
        }
        if (max is double hi && value > hi) { Error(p, $"{F(value)} is too large", $"must be at most {F(hi)}"); return null; }
        return value;
    }

    /// <summary>An integer property.</summary>
    public long? Integer(JsonElement obj, string path, string name, bool required = false, long min = long.MinValue, long max = long.MaxValue)
    {
        string p = $"{path}.{name}";
        if (!obj.TryGetProperty(name, out JsonElement v))
        {
            if (required) Error(path, $"missing required property \"{name}\"", "add it as a whole number");
            return null;
        }
        if (v.ValueKind != JsonValueKind.Number || !v.TryGetInt64(out long value))
        {
            Error(p, $"expected a whole number, found {Describe(v)}", "write an integer without quotes, e.g. 3");
            return null;
        }
        if (value < min || value > max) { Error(p, $"{value} is outside {min}…{max}", $"give a whole number from {min} to {max}"); return null; }
        return value;
    }

    /// <summary>A string property.</summary>
    public string? String(JsonElement obj, string path, string name, bool required = false)
    {
        if (!obj.TryGetProperty(name, out JsonElement v))
        {
            if (required) Error(path, $"missing required property \"{name}\"", "add it as a quoted string");
            return null;
        }
        if (v.ValueKind != JsonValueKind.String) { Error($"{path}.{name}", $"expected a string, found {Describe(v)}", "put the value in double quotes"); return null; }
        return v.GetString();
    }

    /// <summary>A boolean property.</summary>
    public bool? Bool(JsonElement obj, string path, string name)
    {
        if (!obj.TryGetProperty(name, out JsonElement v)) return null;
        if (v.ValueKind is JsonValueKind.True or JsonValueKind.False) return v.GetBoolean();
        Error($"{path}.{name}", $"expected true or false, found {Describe(v)}", "write true or false without quotes");
        return null;
    }

    /// <summary>A clock-time property "HH:mm" or "HH:mm:ss[.fff]".</summary>
    public TimeSpan? Clock(JsonElement obj, string path, string name, bool required = false)
    {
        if (!obj.TryGetProperty(name, out JsonElement v))
        {
            if (required) Error(path, $"missing required property \"{name}\"", "a clock time such as \"21:40\"");
            return null;
        }
        return ClockValue(v, $"{path}.{name}");
    }

    /// <summary>A list of clock times.</summary>
    public List<TimeSpan>? ClockList(JsonElement obj, string path, string name)
    {
        if (!obj.TryGetProperty(name, out JsonElement v)) return null;
        if (v.ValueKind != JsonValueKind.Array) { Error($"{path}.{name}", $"expected an array of clock times, found {Describe(v)}", "write e.g. [\"21:40\", \"23:05\"]"); return null; }
        var list = new List<TimeSpan>();
        int i = 0;
        foreach (JsonElement item in v.EnumerateArray())
        {
            if (ClockValue(item, $"{path}.{name}[{i}]") is TimeSpan t) list.Add(t);
            i++;
        }
        return list;
    }

    /// <summary>Parses one clock-time value.</summary>
    public TimeSpan? ClockValue(JsonElement v, string path)
    {
        if (v.ValueKind == JsonValueKind.String && TryParseClock(v.GetString(), out TimeSpan t)) return t;
        Error(path, $"expected a clock time, found {Describe(v)}", "write \"HH:mm\" or \"HH:mm:ss\" (24-hour clock, 00:00–23:59:59)");
        return null;
    }

    /// <summary>Parses "HH:mm", "HH:mm:ss" or "HH:mm:ss.fff" (24-hour clock).</summary>
    public static bool TryParseClock(string? text, out TimeSpan value)
    {
        value = default;
        if (string.IsNullOrWhiteSpace(text)) return false;
        string[] formats = ["H\\:mm", "HH\\:mm", "H\\:mm\\:ss", "HH\\:mm\\:ss", "H\\:mm\\:ss\\.FFFFFFF", "HH\\:mm\\:ss\\.FFFFFFF"];
        if (!TimeOnly.TryParseExact(text.Trim(), formats, CultureInfo.InvariantCulture, DateTimeStyles.None, out TimeOnly t)) return false;
        value = t.ToTimeSpan();
        return true;
    }

    /// <summary>Short description of a JSON value for messages.</summary>
    public static string Describe(JsonElement v) => v.ValueKind switch
    {
        JsonValueKind.String => $"\"{v.GetString()}\"",
        JsonValueKind.Number => v.GetRawText(),
        JsonValueKind.Object => "an object",
        JsonValueKind.Array => "an array",
        JsonValueKind.True => "true",
        JsonValueKind.False => "false",
        JsonValueKind.Null => "null",
        _ => "nothing",
    };

    private static int EditDistance(string a, string b)
    {
        var d = new int[a.Length + 1, b.Length + 1];
        for (int i = 0; i <= a.Length; i++) d[i, 0] = i;
        for (int j = 0; j <= b.Length; j++) d[0, j] = j;
        for (int i = 1; i <= a.Length; i++)
            for (int j = 1; j <= b.Length; j++)
                d[i, j] = Math.Min(Math.Min(d[i - 1, j] + 1, d[i, j - 1] + 1), d[i - 1, j - 1] + (char.ToLowerInvariant(a[i - 1]) == char.ToLowerInvariant(b[j - 1]) ? 0 : 1));
        return d[a.Length, b.Length];
    }

    private static string F(double x) => x.ToString("G6", CultureInfo.InvariantCulture);

    /// <summary>Long text echoed in a message is cut to its first 40 characters.</summary>
    private static string Clip(string text) => text.Length <= 40 ? text : text[..40] + "…";
}
