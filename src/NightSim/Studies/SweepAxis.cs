using System.Globalization;
using NightSim.Units;

namespace NightSim.Studies;

/// <summary>What a sweep axis sets.</summary>
public enum SweepTarget
{
    /// <summary>A part parameter: "PART.param".</summary>
    Part,

    /// <summary>A number in the scenario: "scenario.events[0].peakLux".</summary>
    ScenarioField,

    /// <summary>Which scenario file: "scenario"; the values are positions in <see cref="SweepAxis.Labels"/>.</summary>
    ScenarioFile,
}

/// <summary>One swept quantity — a part parameter, a number in the scenario or the scenario file itself — and its
/// values (SI), as given on the command line.</summary>
public sealed record SweepAxis(string PartId, string Parameter, IReadOnlyList<double> Values, string Text, bool LogScale, string Unit)
{
    /// <summary>The prefix that sends an axis to the scenario instead of a part.</summary>
    public const string ScenarioPrefix = "scenario";

    /// <summary>What the axis sets.</summary>
    public SweepTarget Target { get; init; } = SweepTarget.Part;

    /// <summary>Names of the values of a <see cref="SweepTarget.ScenarioFile"/> axis (the files), else null.</summary>
    public IReadOnlyList<string>? Labels { get; init; }

    /// <summary>The values were written with prefixes but no unit ("-1m" in a scenario): print them the same way.</summary>
    public bool Prefixed { get; init; }

    /// <summary>"PART.param", "scenario.path" or "scenario".</summary>
    public string Key => Target == SweepTarget.ScenarioFile ? ScenarioPrefix : PartId + "." + Parameter;

    /// <summary>A value as people read it: the file for a scenario axis, else the number with its prefix and unit.</summary>
    public string Label(double value) =>
        Labels is not null && value >= 0 && value < Labels.Count ? Labels[(int)value]
        : Prefixed && Unit.Length == 0 ? EngineeringValue.Format(value, "x", 3)[..^1].Replace(" ", "", StringComparison.Ordinal)
        : EngineeringValue.Format(value, Unit, 3);

    /// <summary>
    /// Parses the values of "--vary PART.PARAM=VALUES": a list ("10n,22n,47n"), a range with a count ("1n..100n/7",
    /// log-spaced when it spans a decade or more, else even), or a series with bounds ("E12:1n..100n").
    /// Null with <paramref name="error"/> when malformed.
    /// </summary>
    public static IReadOnlyList<double>? ParseValues(string text, string? unit, out bool logScale, out string? error)
    {
        error = null;
        logScale = false;
        text = text.Trim();
        int colon = text.IndexOf(':', StringComparison.Ordinal);
        if (colon > 0)
        {
            IReadOnlyList<double>? decade = ESeries.Decade(text[..colon]);
            if (decade is null) { error = $"'{text[..colon]}' is not a series; use E6, E12 or E24"; return null; }
            if (!Bounds(text[(colon + 1)..], unit, out double lo, out double hi, out error)) return null;
            if (!(lo > 0)) { error = "a series needs bounds above 0"; return null; }
            logScale = true;
            List<double> list = ESeries.Between(decade, lo, hi);
            if (list.Count == 0) error = $"no {text[..colon].ToUpperInvariant()} value lies between the bounds";
            return list.Count == 0 ? null : list;
        }
        if (text.Contains("..", StringComparison.Ordinal))
        {
            int slash = text.LastIndexOf('/');
            if (slash < 0 || !int.TryParse(text[(slash + 1)..], NumberStyles.None, CultureInfo.InvariantCulture, out int count) || count < 2 || count > 1000)
            {
                error = "a range needs a count of 2 to 1000 points, e.g. 1n..100n/7";
                return null;
            }
            if (!Bounds(text[..slash], unit, out double lo, out double hi, out error)) return null;
            logScale = lo > 0 && hi / lo >= 10;
            var list = new List<double>(count);
            for (int i = 0; i < count; i++)
            {
                double f = (double)i / (count - 1);
                list.Add(logScale ? lo * Math.Pow(hi / lo, f) : lo + f * (hi - lo));
            }
            list[^1] = hi;
            return list;
        }
        var values = new List<double>();
        foreach (string part in text.Split(','))
        {
            if (!EngineeringValue.TryParse(part.Trim(), unit, out double v, out EngineeringValueError? e))
            {
                error = $"'{part.Trim()}': {e}";
                return null;
            }
            values.Add(v);
        }
        logScale = values.Count > 1 && values.All(v => v > 0) && values.Max() / values.Min() >= 10;
        return values;
    }

    private static bool Bounds(string text, string? unit, out double lo, out double hi, out string? error)
    {
        lo = hi = 0;
        error = null;
        string[] b = text.Split("..");
        if (b.Length != 2 || !EngineeringValue.TryParse(b[0].Trim(), unit, out lo, out string? e0) || !EngineeringValue.TryParse(b[1].Trim(), unit, out hi, out string? e1))
        {
            error = $"'{text}' is not a range; write LOW..HIGH, e.g. 1n..100n";
            return false;
        }
        if (!(hi > lo)) { error = $"'{text}': the upper bound must be above the lower"; return false; }
        return true;
    }
}
