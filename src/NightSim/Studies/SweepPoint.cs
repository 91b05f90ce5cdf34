using System.Text.Json;

namespace NightSim.Studies;

/// <summary>One point of a sweep: the swept values and the night run's outcome.</summary>
public sealed record SweepPoint(int Index, IReadOnlyList<KeyValuePair<string, double>> Values, StudyOutcome Outcome) : IStudyItem
{
    public void Write(Utf8JsonWriter w)
    {
        w.WriteStartObject();
        w.WriteNumber("index", Index);
        w.WriteStartObject("values");
        foreach ((string k, double v) in Values) w.WriteNumber(k, v);
        w.WriteEndObject();
        Outcome.WriteProperties(w);
        w.WriteEndObject();
    }

    public static SweepPoint Read(JsonElement e) => new(
        e.GetProperty("index").GetInt32(),
        e.GetProperty("values").EnumerateObject().Select(p => new KeyValuePair<string, double>(p.Name, p.Value.GetDouble())).ToList(),
        StudyOutcome.Read(e));
}
