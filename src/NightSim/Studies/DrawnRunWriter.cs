using System.Globalization;
using System.Text.Json;
using System.Text.Json.Nodes;
using NightSim.Reporting;

namespace NightSim.Studies;

/// <summary>
/// Writes the netlist and scenario of one study run as files `simulate` takes: the original netlist with the drawn
/// values written into its parts, and the original scenario with the run's seed (and drawn sky). The scenario goes
/// beside the netlist as &lt;name&gt;.scenario.json, so `nightsim simulate DIR/runs/run-0042.json` repeats the run.
/// </summary>
public static class DrawnRunWriter
{
    /// <summary>Writes both files atomically; returns the netlist path.</summary>
    public static string Write(string netlistSource, string? scenarioSource, string netlistTarget,
        IReadOnlyList<KeyValuePair<string, double>> values, ulong? seed, string? sky)
    {
        JsonNode net = Parse(netlistSource);
        if (net["parts"] is JsonArray parts)
        {
            foreach ((string key, double value) in values)
            {
                int dot = key.IndexOf('.', StringComparison.Ordinal);
                string id = key[..dot], name = key[(dot + 1)..];
                if (parts.FirstOrDefault(p => p?["id"]?.GetValue<string>() == id) is JsonObject part) part[name] = value;
            }
        }
        net["description"] = $"Drawn from {Path.GetFileName(netlistSource)} by a NightSim study: {(string?)net["description"] ?? ""}".Trim();
        net.AsObject().Remove("$schema");
        Directory.CreateDirectory(Path.GetDirectoryName(Path.GetFullPath(netlistTarget))!);
        AtomicFile.WriteText(netlistTarget, net.ToJsonString(s_options) + "\n");
        if (scenarioSource is not null)
        {
            JsonNode sc = Parse(scenarioSource);
            sc.AsObject().Remove("$schema");
            if (seed is ulong s) sc["seed"] = s;
            if (sky is not null)
            {
                if (sc["weather"] is not JsonObject weather) sc["weather"] = weather = [];
                weather["sky"] = sky;
            }
            string scenarioTarget = Path.Combine(Path.GetDirectoryName(netlistTarget) ?? "", Path.GetFileNameWithoutExtension(netlistTarget) + ".scenario.json");
            AtomicFile.WriteText(scenarioTarget, sc.ToJsonString(s_options) + "\n");
        }
        return netlistTarget;
    }

    private static readonly JsonSerializerOptions s_options = new()
    {
        WriteIndented = true,
        Encoder = System.Text.Encodings.Web.JavaScriptEncoder.UnsafeRelaxedJsonEscaping,
    };

    private static JsonNode Parse(string path)
    {
        try
        {
            return JsonNode.Parse(File.ReadAllBytes(path), documentOptions: StudyJson.ReadOptions)
                ?? throw new StudyFileException([$"{path}: error: empty file"]);
        }
        catch (JsonException ex)
        {
            throw new StudyFileException([string.Create(CultureInfo.InvariantCulture, $"{path}: error: not valid JSON ({ex.Message.ReplaceLineEndings(" ")})")]);
        }
    }
}
