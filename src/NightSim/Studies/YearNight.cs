using System.Globalization;
using System.Text.Json;

namespace NightSim.Studies;

/// <summary>One date of a year study: the night's sky and sun times and the outcome of its night run.</summary>
public sealed record YearNight(int Index, DateOnly Date, string Sky, string? Sunset, string? Sunrise, StudyOutcome Outcome) : IStudyItem
{
    public void Write(Utf8JsonWriter w)
    {
        w.WriteStartObject();
        w.WriteNumber("index", Index);
        w.WriteString("date", Date.ToString("yyyy-MM-dd", CultureInfo.InvariantCulture));
        w.WriteString("sky", Sky);
        StudyJson.StringOrNull(w, "sunset", Sunset);
        StudyJson.StringOrNull(w, "sunrise", Sunrise);
        Outcome.WriteProperties(w);
        w.WriteEndObject();
    }

    public static YearNight Read(JsonElement e) => new(
        e.GetProperty("index").GetInt32(),
        DateOnly.ParseExact(e.GetProperty("date").GetString()!, "yyyy-MM-dd", CultureInfo.InvariantCulture),
        e.GetProperty("sky").GetString()!,
        StudyJson.OptString(e, "sunset"),
        StudyJson.OptString(e, "sunrise"),
        StudyOutcome.Read(e));
}
