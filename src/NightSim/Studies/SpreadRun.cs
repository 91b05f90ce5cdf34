using System.Text.Json;

namespace NightSim.Studies;

/// <summary>One run of a spread: its index, seed, the drawn part values and the outcome.</summary>
/// <param name="Index">Run index, 0-based.</param>
/// <param name="Seed">Seed of this run's draws and of its scenario's random events.</param>
/// <param name="Label">"random" or, for a corner run, which extreme ("nominal", "R1.value low").</param>
/// <param name="Sky">Sky drawn from the scenario's weather mix, or null.</param>
/// <param name="Values">"PART.parameter" → value (SI), in the order of the variations.</param>
/// <param name="Outcome">What the run did.</param>
public sealed record SpreadRun(int Index, ulong Seed, string Label, string? Sky, IReadOnlyList<KeyValuePair<string, double>> Values, StudyOutcome Outcome) : IStudyItem
{
    public void Write(Utf8JsonWriter w)
    {
        w.WriteStartObject();
        w.WriteNumber("index", Index);
        w.WriteNumber("seed", Seed);
        w.WriteString("label", Label);
        StudyJson.StringOrNull(w, "sky", Sky);
        w.WriteStartObject("values");
        foreach ((string k, double v) in Values) w.WriteNumber(k, v);
        w.WriteEndObject();
        Outcome.WriteProperties(w);
        w.WriteEndObject();
    }

    public static SpreadRun Read(JsonElement e) => new(
        e.GetProperty("index").GetInt32(),
        e.GetProperty("seed").GetUInt64(),
        e.GetProperty("label").GetString()!,
        StudyJson.OptString(e, "sky"),
        e.GetProperty("values").EnumerateObject().Select(p => new KeyValuePair<string, double>(p.Name, p.Value.GetDouble())).ToList(),
        StudyOutcome.Read(e));
}
