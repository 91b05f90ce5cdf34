using System.Globalization;
using System.Text;
using System.Text.Json;
using System.Text.Json.Nodes;
using NightSim.Sky;
using NightSim.Text;
using NightSim.Units;

namespace NightSim.Studies;

/// <summary>
/// The scenarios a sweep runs: one or more scenario files, each read once, and numbers inside them set per point
/// ("scenario.events[0].peakLux", "scenario.weather.floorLux"). A variant is the file's JSON with the given numbers
/// written in, read again by <see cref="ScenarioLoader"/>, so a swept value is checked exactly as if the user had typed
/// it into the file.
/// </summary>
public sealed class ScenarioVariants
{
    private readonly List<(string Path, JsonNode Root, string BaseDirectory)> _files = [];

    private ScenarioVariants() { }

    /// <summary>The scenario files, in the order given.</summary>
    public IReadOnlyList<string> Files => [.. _files.Select(f => f.Path)];

    /// <summary>Reads the scenario files; a file that cannot be read or is not JSON throws
    /// <see cref="StudyFileException"/> naming it (each file is also loaded once in full, so every other mistake is
    /// reported with its line as for a single run).</summary>
    public static ScenarioVariants Read(IReadOnlyList<string> paths)
    {
        var v = new ScenarioVariants();
        foreach (string path in paths)
        {
            ScenarioLoader.LoadOrThrow(path);
            byte[] bytes = Utf8Check.ReadBounded(path, InputLimits.MaxInputBytes, out _)
                ?? throw new StudyFileException([$"{path}: error at $: the file is too large"]);
            if (bytes.AsSpan().StartsWith((ReadOnlySpan<byte>)[0xEF, 0xBB, 0xBF])) bytes = bytes[3..];
            JsonNode root = JsonNode.Parse(bytes, documentOptions: new JsonDocumentOptions { CommentHandling = JsonCommentHandling.Skip, AllowTrailingCommas = true })
                ?? throw new StudyFileException([$"{path}: error at $: the file holds no JSON object"]);
            v._files.Add((path, root, Path.GetDirectoryName(Path.GetFullPath(path)) ?? Directory.GetCurrentDirectory()));
        }
        return v;
    }

    /// <summary>
    /// Checks that <paramref name="path"/> ("events[0].peakLux") names a number in every file; null when it does, else
    /// the reason. A number written as text with a prefix ("-1m") counts as a number.
    /// </summary>
    public string? CheckNumber(string path)
    {
        if (!TryParsePath(path, out List<object> segments, out string? why)) return why;
        foreach ((string file, JsonNode root, _) in _files)
        {
            JsonNode? node = Find(root, segments);
            if (node is null) return $"{file} has nothing at $.{path}";
            if (node is not JsonValue value) return $"{file}: $.{path} holds {(node is JsonArray ? "a list" : "an object")}, not a number";
            if (value.TryGetValue(out double _)) continue;
            if (value.TryGetValue(out string? text) && EngineeringValue.TryParse(text, null, out double _, out string? _)) continue;
            return $"{file}: $.{path} holds {value.ToJsonString()}, not a number";
        }
        return null;
    }

    /// <summary>
    /// The scenario of file <paramref name="file"/> with each (path, value) written in; throws
    /// <see cref="StudyFileException"/> with the loader's messages when a value makes the scenario invalid.
    /// </summary>
    public LightScenario Build(int file, IReadOnlyList<KeyValuePair<string, double>> fields)
    {
        (string path, JsonNode root, string baseDir) = _files[file];
        JsonNode copy = root.DeepClone();
        var name = new StringBuilder(path);
        foreach ((string field, double value) in fields)
        {
            if (!TryParsePath(field, out List<object> segments, out string? why)) throw new StudyFileException([$"{path}: error: {why}"]);
            JsonNode node = Find(copy, segments) ?? throw new StudyFileException([$"{path}: error at $.{field}: not found"]);
            node.ReplaceWith(JsonValue.Create(value));
            name.Append(string.Create(CultureInfo.InvariantCulture, $" with {field} = {value:G6}"));
        }
        LightScenario? scenario = ScenarioLoader.Parse(copy.ToJsonString(), name.ToString(), baseDir, out IReadOnlyList<ScenarioError> errors);
        // Lines and columns would point into the rewritten copy, not the user's file: leave them out.
        return scenario ?? throw new StudyFileException([.. errors.Select(e => (e with { Line = 0, Column = 0 }).ToString())]);
    }

    /// <summary>Whether the number at <paramref name="path"/> is written as text ("-1m") in the first file.</summary>
    public bool WrittenAsText(string path) =>
        TryParsePath(path, out List<object> segments, out _) && Find(_files[0].Root, segments) is JsonValue v && v.TryGetValue(out string? _);

    /// <summary>Splits "events[0].peakLux" into "events", 0, "peakLux".</summary>
    public static bool TryParsePath(string path, out List<object> segments, out string? error)
    {
        segments = [];
        error = null;
        foreach (string part in path.Split('.'))
        {
            string rest = part;
            int open = rest.IndexOf('[', StringComparison.Ordinal);
            string name = open < 0 ? rest : rest[..open];
            if (name.Length > 0) segments.Add(name);
            else if (open != 0) { error = $"'{path}' has an empty name; write e.g. events[0].peakLux"; return false; }
            while (open >= 0)
            {
                int close = rest.IndexOf(']', open);
                if (close < 0 || !int.TryParse(rest.AsSpan(open + 1, close - open - 1), NumberStyles.None, CultureInfo.InvariantCulture, out int index))
                {
                    error = $"'{path}': write a list position as [0], [1], …";
                    return false;
                }
                segments.Add(index);
                rest = rest[(close + 1)..];
                open = rest.Length == 0 ? -1 : rest[0] == '[' ? 0 : -2;
                if (open == -2) { error = $"'{path}': unexpected '{rest}' after a list position"; return false; }
            }
        }
        if (segments.Count == 0) error = $"'{path}' names nothing; write e.g. weather.floorLux";
        return error is null;
    }

    private static JsonNode? Find(JsonNode root, List<object> segments)
    {
        JsonNode? node = root;
        foreach (object s in segments)
        {
            node = (s, node) switch
            {
                (string key, JsonObject o) => o.TryGetPropertyValue(key, out JsonNode? child) ? child : null,
                (int i, JsonArray a) => i < a.Count ? a[i] : null,
                _ => null,
            };
            if (node is null) return null;
        }
        return node;
    }
}
