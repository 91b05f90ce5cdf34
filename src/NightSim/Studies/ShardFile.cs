using System.Text.Json;
using NightSim.Inputs;
using NightSim.Reporting;

namespace NightSim.Studies;

/// <summary>
/// The result of one shard of a study: the header, which shard it is, and its finished items as JSON. Written
/// atomically as "shard-i-of-n.json"; `nightsim merge` joins them into the files the unsharded run writes.
/// </summary>
public sealed record ShardFile(StudyHeader Header, ShardSpec Shard, IReadOnlyList<JsonElement> Items, string Path)
{
    /// <summary>Writes a shard file atomically.</summary>
    public static void Write(string path, StudyHeader header, ShardSpec shard, IEnumerable<IStudyItem> items) =>
        AtomicFile.Write(path, s => s.Write(StudyJson.Bytes(w =>
        {
            w.WriteStartObject();
            header.WriteProperties(w);
            w.WriteStartObject("shard");
            w.WriteNumber("index", shard.Index);
            w.WriteNumber("count", shard.Count);
            w.WriteEndObject();
            w.WriteStartArray("items");
            foreach (IStudyItem item in items) item.Write(w);
            w.WriteEndArray();
            w.WriteEndObject();
        })));

    /// <summary>Reads a shard file; bad content throws <see cref="StudyFileException"/> naming the file.</summary>
    public static ShardFile Read(string path)
    {
        try
        {
            using JsonDocument doc = JsonDocument.Parse(Text.Utf8Check.ReadAllBounded(path, InputLimits.MaxReportBytes), StudyJson.ReadOptions);
            JsonElement root = doc.RootElement;
            StudyHeader header = StudyHeader.Read(root);
            JsonElement sh = root.GetProperty("shard");
            var shard = new ShardSpec(sh.GetProperty("index").GetInt32(), sh.GetProperty("count").GetInt32());
            var items = root.GetProperty("items").EnumerateArray().Select(e => e.Clone()).ToList();
            return new ShardFile(header, shard, items, path);
        }
        catch (Exception ex) when (ex is JsonException or KeyNotFoundException or InvalidOperationException or FormatException)
        {
            throw new StudyFileException([$"{path}: error: not a study shard file ({ex.Message.ReplaceLineEndings(" ")}). hint: merge the shard-i-of-n.json files that `--shard` wrote"]);
        }
    }

    /// <summary>
    /// Joins shard files into the whole study: the same header everywhere, every shard 1…n once, every item once.
    /// Returns the header and the items in index order.
    /// </summary>
    public static (StudyHeader Header, List<JsonElement> Items) Join(IReadOnlyList<ShardFile> shards)
    {
        if (shards.Count == 0) throw new StudyFileException(["merge: error: no shard-*.json files found. hint: give the folders the sharded runs wrote (--out)"]);
        ShardFile first = shards[0];
        string identity = first.Header.Identity();
        var problems = new List<string>();
        foreach (ShardFile s in shards.Skip(1))
        {
            if (s.Header.Identity() != identity) problems.Add($"{s.Path}: error: belongs to a different study than {first.Path} (netlist, scenario, seed, settings or tool differ)");
            if (s.Shard.Count != first.Shard.Count) problems.Add($"{s.Path}: error: is one of {s.Shard.Count} shards, {first.Path} one of {first.Shard.Count}");
        }
        var seen = new Dictionary<int, string>();
        foreach (ShardFile s in shards)
        {
            if (!seen.TryAdd(s.Shard.Index, s.Path)) problems.Add($"{s.Path}: error: shard {s.Shard.Index}/{s.Shard.Count} is also in {seen[s.Shard.Index]}");
        }
        var missing = Enumerable.Range(1, first.Shard.Count).Where(i => !seen.ContainsKey(i)).ToList();
        if (missing.Count > 0) problems.Add($"merge: error: shard{(missing.Count == 1 ? "" : "s")} {string.Join(", ", missing.Select(i => $"{i}/{first.Shard.Count}"))} missing. hint: run them with --shard and give their folders too");
        if (problems.Count > 0) throw new StudyFileException(problems);

        var items = shards.SelectMany(s => s.Items).OrderBy(e => e.GetProperty("index").GetInt32()).ToList();
        var indices = items.Select(e => e.GetProperty("index").GetInt32()).ToList();
        if (indices.Count != first.Header.Total || indices.Where((v, i) => v != i).Any())
            throw new StudyFileException([$"merge: error: the shards hold {indices.Count} of {first.Header.Total} items (a shard was stopped early?). hint: re-run the incomplete shard"]);
        return (first.Header, items);
    }
}

/// <summary>A study or shard file that cannot be used (exit code 2).</summary>
public sealed class StudyFileException(IReadOnlyList<string> lines) : InputFileException(string.Join("\n", lines))
{
    public override IReadOnlyList<string> Lines { get; } = lines;
}
