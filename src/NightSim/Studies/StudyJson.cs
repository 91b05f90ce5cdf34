using System.Globalization;
using System.Text;
using System.Text.Json;

namespace NightSim.Studies;

/// <summary>Small JSON and CSV helpers shared by the study files (stable keys, invariant culture).</summary>
public static class StudyJson
{
    /// <summary>Writer options of every study file: indented, plain Unicode.</summary>
    public static readonly JsonWriterOptions Options = new()
    {
        Indented = true,
        Encoder = System.Text.Encodings.Web.JavaScriptEncoder.UnsafeRelaxedJsonEscaping,
    };

    /// <summary>Reader options: comments and trailing commas tolerated.</summary>
    public static readonly JsonDocumentOptions ReadOptions = new() { CommentHandling = JsonCommentHandling.Skip, AllowTrailingCommas = true };

    /// <summary>The UTF-8 bytes of a JSON document written by <paramref name="write"/>.</summary>
    public static byte[] Bytes(Action<Utf8JsonWriter> write)
    {
        using var ms = new MemoryStream();
        using (var w = new Utf8JsonWriter(ms, Options)) write(w);
        ms.WriteByte((byte)'\n');
        return ms.ToArray();
    }

    public static void NumberOrNull(Utf8JsonWriter w, string name, double? v)
    {
        if (v is double x && double.IsFinite(x)) w.WriteNumber(name, x); else w.WriteNull(name);
    }

    public static void StringOrNull(Utf8JsonWriter w, string name, string? v)
    {
        if (v is null) w.WriteNull(name); else w.WriteString(name, v);
    }

    public static double? OptNumber(JsonElement e, string name) =>
        e.TryGetProperty(name, out JsonElement v) && v.ValueKind == JsonValueKind.Number ? v.GetDouble() : null;

    public static string? OptString(JsonElement e, string name) =>
        e.TryGetProperty(name, out JsonElement v) && v.ValueKind == JsonValueKind.String ? v.GetString() : null;

    /// <summary>A CSV cell for a number ("" for null), round-trip precision.</summary>
    public static string Csv(double? v) => v is double x ? x.ToString("R", CultureInfo.InvariantCulture) : "";

    public static string Csv(int v) => v.ToString(CultureInfo.InvariantCulture);

    /// <summary>A CSV line with RFC 4180 quoting where needed.</summary>
    public static string CsvLine(IEnumerable<string> cells)
    {
        var sb = new StringBuilder();
        bool first = true;
        foreach (string c in cells)
        {
            if (!first) sb.Append(',');
            first = false;
            if (c.Contains(',', StringComparison.Ordinal) || c.Contains('"', StringComparison.Ordinal) || c.Contains('\n', StringComparison.Ordinal))
                sb.Append('"').Append(c.Replace("\"", "\"\"", StringComparison.Ordinal)).Append('"');
            else sb.Append(c);
        }
        return sb.ToString();
    }
}
