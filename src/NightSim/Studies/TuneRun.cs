using System.Text.Json;
using NightSim.Targets;

namespace NightSim.Studies;

/// <summary>One target as one run met it.</summary>
/// <param name="Target">Target code ("on-time", "switch-on-lux", …).</param>
/// <param name="Pass">Met on every night of the run.</param>
/// <param name="Margin">Least margin in <paramref name="Unit"/>, or null when nothing was measured.</param>
/// <param name="RelativeMargin">Least margin relative to the target's size (negative: missed).</param>
/// <param name="Unit">"lx", "min", "s" or "count".</param>
/// <param name="Detail">Plain words from the night check.</param>
public sealed record TuneCheck(string Target, bool Pass, double? Margin, double RelativeMargin, string Unit, string Detail)
{
    /// <summary>The least of the checks per target, in the order they first appear.</summary>
    public static List<TuneCheck> From(IEnumerable<TargetCheck> checks) =>
        checks.GroupBy(c => c.Target).Select(g =>
        {
            TargetCheck worst = g.MinBy(c => c.RelativeMargin)!;
            return new TuneCheck(g.Key, g.All(c => c.Pass), worst.Margin is double m ? Math.Round(m, 4) : null, Math.Round(worst.RelativeMargin, 4), worst.Unit, worst.Detail);
        }).ToList();
}

/// <summary>One simulated night of one candidate at one corner of its parts.</summary>
/// <param name="Index">Item index: (candidate rank · nights + night) · corners + corner.</param>
/// <param name="Candidate">Grid index of the candidate.</param>
/// <param name="Night">The night's label and date.</param>
/// <param name="Corner">The corner's label.</param>
/// <param name="Values">Every value set for this run (the candidate's, then the corner's), SI.</param>
/// <param name="Checks">The targets as this run met them.</param>
/// <param name="Failure">Why the simulation failed, or null.</param>
public sealed record TuneRun(int Index, int Candidate, string Night, string Corner, IReadOnlyList<KeyValuePair<string, double>> Values,
    IReadOnlyList<TuneCheck> Checks, string? Failure) : IStudyItem
{
    public bool Pass => Failure is null && Checks.Count > 0 && Checks.All(c => c.Pass);

    public void Write(Utf8JsonWriter w)
    {
        w.WriteStartObject();
        w.WriteNumber("index", Index);
        w.WriteNumber("candidate", Candidate);
        w.WriteString("night", Night);
        w.WriteString("corner", Corner);
        w.WriteStartObject("values");
        foreach ((string k, double v) in Values) w.WriteNumber(k, v);
        w.WriteEndObject();
        w.WriteStartArray("targets");
        foreach (TuneCheck c in Checks)
        {
            w.WriteStartObject();
            w.WriteString("target", c.Target);
            w.WriteBoolean("pass", c.Pass);
            StudyJson.NumberOrNull(w, "margin", c.Margin);
            w.WriteNumber("relativeMargin", c.RelativeMargin);
            w.WriteString("unit", c.Unit);
            w.WriteString("detail", c.Detail);
            w.WriteEndObject();
        }
        w.WriteEndArray();
        w.WriteBoolean("pass", Pass);
        StudyJson.StringOrNull(w, "failure", Failure);
        w.WriteEndObject();
    }

    public static TuneRun Read(JsonElement e) => new(
        e.GetProperty("index").GetInt32(),
        e.GetProperty("candidate").GetInt32(),
        e.GetProperty("night").GetString()!,
        e.GetProperty("corner").GetString()!,
        e.GetProperty("values").EnumerateObject().Select(p => new KeyValuePair<string, double>(p.Name, p.Value.GetDouble())).ToList(),
        e.GetProperty("targets").EnumerateArray().Select(t => new TuneCheck(
            t.GetProperty("target").GetString()!, t.GetProperty("pass").GetBoolean(), StudyJson.OptNumber(t, "margin"),
            t.GetProperty("relativeMargin").GetDouble(), t.GetProperty("unit").GetString()!, t.GetProperty("detail").GetString()!)).ToList(),
        StudyJson.OptString(e, "failure"));
}
