using System.Text.Json;
using System.Text.RegularExpressions;

namespace NightSim.Reporting;

/// <summary>
/// The list of files NightSim wrote into an output folder, kept in the folder as <see cref="FileName"/>: a later run
/// replaces or removes exactly these and never touches anything else there. A folder written before the list existed
/// is read by the names earlier versions wrote (<see cref="IsEarlierOutput"/>).
/// </summary>
public static partial class OutputManifest
{
    /// <summary>The list's file name in the output folder (hidden on Unix).</summary>
    public const string FileName = ".nightsim-files.json";

    /// <summary>The files listed in <paramref name="folder"/>'s manifest (relative, '/'-separated), or null when it has
    /// none or it cannot be read. Entries that would reach outside the folder are dropped.</summary>
    public static IReadOnlySet<string>? Read(string folder)
    {
        string path = Path.Combine(folder, FileName);
        if (!File.Exists(path)) return null;
        try
        {
            byte[]? bytes = Text.Utf8Check.ReadBounded(path, 16 * 1024 * 1024, out _);
            if (bytes is null) return null;
            using JsonDocument doc = JsonDocument.Parse(bytes);
            if (!doc.RootElement.TryGetProperty("files", out JsonElement files) || files.ValueKind != JsonValueKind.Array) return null;
            var set = new HashSet<string>(StringComparer.Ordinal);
            foreach (JsonElement f in files.EnumerateArray())
            {
                if (f.ValueKind == JsonValueKind.String && f.GetString() is { } name && IsSafe(name)) set.Add(name);
            }
            return set;
        }
        catch (Exception ex) when (ex is IOException or UnauthorizedAccessException or JsonException or InvalidOperationException)
        {
            return null;
        }
    }

    /// <summary>Writes the manifest of <paramref name="files"/> into <paramref name="folder"/> (atomically).</summary>
    public static void Write(string folder, IEnumerable<string> files)
    {
        AtomicFile.Write(Path.Combine(folder, FileName), s =>
        {
            using var w = new Utf8JsonWriter(s, new JsonWriterOptions { Indented = true });
            w.WriteStartObject();
            w.WriteString("about", "The files nightsim wrote in this folder. The next run into this folder replaces or removes exactly these; it leaves every other file alone.");
            w.WriteStartArray("files");
            foreach (string f in files.Order(StringComparer.Ordinal)) w.WriteStringValue(f);
            w.WriteEndArray();
            w.WriteEndObject();
        });
    }

    /// <summary>A relative '/'-separated path inside the folder: not rooted, no "..", no empty or "." parts.</summary>
    public static bool IsSafe(string relative) =>
        relative.Length > 0 && !Path.IsPathRooted(relative) && !relative.Contains('\\') && !relative.Contains('\0')
        && relative.Split('/').All(p => p.Length > 0 && p != "." && p != "..");

    /// <summary>A name the versions before the manifest wrote into an output folder (report, trace, statistics,
    /// partial outputs, plots), or a temporary file of one of them left by a killed run.</summary>
    public static bool IsEarlierOutput(string relative) =>
        EarlierName().IsMatch(relative) || (TemporaryOf(relative) is { } of && EarlierName().IsMatch(of));

    /// <summary>The file a temporary file ".NAME.PID.tmp" (written by <see cref="AtomicFile"/>) was meant to become, or null.</summary>
    public static string? TemporaryOf(string relative)
    {
        int slash = relative.LastIndexOf('/');
        Match m = TemporaryName().Match(relative[(slash + 1)..]);
        return m.Success ? relative[..(slash + 1)] + m.Groups["name"].Value : null;
    }

    [GeneratedRegex(@"^(report\.json|report\.html|trace\.csv|statistics\.json|report-partial\.json|trace-partial\.csv|[A-Za-z0-9._-]+-partial\.(svg|png)|(night|zoom|detail)-[A-Za-z0-9._-]+\.(svg|png))$")]
    private static partial Regex EarlierName();

    [GeneratedRegex(@"^\.(?<name>.+)\.[0-9]+\.tmp$")]
    private static partial Regex TemporaryName();
}
