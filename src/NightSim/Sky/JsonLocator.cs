using System.Text.Json;
using NightSim.Text;

namespace NightSim.Sky;

/// <summary>
/// Line and column (1-based) of every value in a JSON text, keyed by JSON path ("$.events[2].peakLux"), found by one
/// pass of <see cref="Utf8JsonReader"/>. Lets semantic errors name the place in the file.
/// </summary>
public sealed class JsonLocator
{
    private readonly Dictionary<string, (int Line, int Column)> _positions = new(StringComparer.Ordinal);

    /// <summary>Builds the map; a text that does not parse gives a partial map.</summary>
    public JsonLocator(byte[] utf8)
    {
        ArgumentNullException.ThrowIfNull(utf8);
        var positions = new Utf8Positions(utf8);
        var options = new JsonReaderOptions { CommentHandling = JsonCommentHandling.Skip, AllowTrailingCommas = true };
        var reader = new Utf8JsonReader(utf8, options);
        // Stack of containers: path and, for arrays, the next index.
        var stack = new List<(string Path, bool IsArray, int Index)>();
        string? pendingProperty = null;
        try
        {
            while (reader.Read())
            {
                JsonTokenType tt = reader.TokenType;
                if (tt == JsonTokenType.PropertyName)
                {
                    pendingProperty = reader.GetString();
                    continue;
                }
                if (tt is JsonTokenType.EndObject or JsonTokenType.EndArray)
                {
                    stack.RemoveAt(stack.Count - 1);
                    continue;
                }
                string path;
                if (stack.Count == 0) path = "$";
                else
                {
                    var top = stack[^1];
                    if (top.IsArray)
                    {
                        path = $"{top.Path}[{top.Index}]";
                        stack[^1] = (top.Path, true, top.Index + 1);
                    }
                    else path = $"{top.Path}.{pendingProperty}";
                }
                _positions.TryAdd(path, positions.At(reader.TokenStartIndex));
                if (tt is JsonTokenType.StartObject) stack.Add((path, false, 0));
                else if (tt is JsonTokenType.StartArray) stack.Add((path, true, 0));
            }
        }
        catch (Exception ex) when (ex is JsonException or InvalidOperationException)
        {
            // Partial map; the syntax error (or a key that is not text) is reported by the loader.
        }
    }

    /// <summary>Position of the value at <paramref name="path"/>, or of its nearest enclosing value; (0, 0) if unknown.</summary>
    public (int Line, int Column) Find(string path)
    {
        string p = path;
        while (true)
        {
            if (_positions.TryGetValue(p, out var pos)) return pos;
            int cut = Math.Max(p.LastIndexOf('.'), p.LastIndexOf('['));
            if (cut <= 0) return (0, 0);
            p = p[..cut];
        }
    }
}
