using System.Globalization;
using System.Text.Json;

namespace NightSim.Studies;

/// <summary>
/// What a study is: its kind, the tool, the input files, the seed, the number of items and the settings that shape
/// them. Every shard of a study carries the same header; joining shards checks that they match.
/// </summary>
public sealed record StudyHeader
{
    /// <summary>"spread", "sweep" or "year".</summary>
    public required string Kind { get; init; }
    public required string Tool { get; init; }
    public required string Netlist { get; init; }
    public string? Scenario { get; init; }
    public ulong Seed { get; init; }
    /// <summary>Items in the whole study.</summary>
    public int Total { get; init; }
    /// <summary>Settings in a fixed order (name → text), e.g. runs, corners, vary.</summary>
    public IReadOnlyList<KeyValuePair<string, string>> Settings { get; init; } = [];

    /// <summary>Writes the header's properties into the current object.</summary>
    public void WriteProperties(Utf8JsonWriter w)
    {
        w.WriteString("study", Kind);
        w.WriteString("tool", Tool);
        w.WriteString("netlist", Netlist);
        StudyJson.StringOrNull(w, "scenario", Scenario);
        w.WriteNumber("seed", Seed);
        w.WriteNumber("total", Total);
        w.WriteStartObject("settings");
        foreach ((string k, string v) in Settings) w.WriteString(k, v);
        w.WriteEndObject();
    }

    public static StudyHeader Read(JsonElement e) => new()
    {
        Kind = e.GetProperty("study").GetString()!,
        Tool = e.GetProperty("tool").GetString()!,
        Netlist = e.GetProperty("netlist").GetString()!,
        Scenario = StudyJson.OptString(e, "scenario"),
        Seed = e.GetProperty("seed").GetUInt64(),
        Total = e.GetProperty("total").GetInt32(),
        Settings = e.GetProperty("settings").EnumerateObject().Select(p => new KeyValuePair<string, string>(p.Name, p.Value.GetString() ?? "")).ToList(),
    };

    /// <summary>A text that is equal for equal headers.</summary>
    public string Identity() => System.Text.Encoding.UTF8.GetString(StudyJson.Bytes(w => { w.WriteStartObject(); WriteProperties(w); w.WriteEndObject(); }));

    /// <summary>A setting's value, or null.</summary>
    public string? Setting(string name) => Settings.FirstOrDefault(s => s.Key == name).Value;

    public override string ToString() => string.Create(CultureInfo.InvariantCulture, $"{Kind} of {Netlist} ({Total} items)");
}
