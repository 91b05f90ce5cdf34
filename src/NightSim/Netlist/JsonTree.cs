using System.Text;
using System.Text.Json;
using NightSim.Text;

namespace NightSim.Netlist;

/// <summary>Kind of a value in a <see cref="JsonTree"/>.</summary>
internal enum JsonTreeKind
{
    Object,
    Array,
    String,
    Number,
    True,
    False,
    Null,
}

/// <summary>
/// A small JSON tree that remembers where each value and property name stands (1-based line and column), which
/// <see cref="JsonDocument"/> does not. Read with <see cref="Utf8JsonReader"/>: comments and trailing commas allowed.
/// </summary>
internal sealed class JsonTree
{
    private JsonTree(JsonTreeKind kind, int line, int column)
    {
        Kind = kind;
        Line = line;
        Column = column;
    }

    public JsonTreeKind Kind { get; }

    public int Line { get; }

    public int Column { get; }

    /// <summary>String value, or the number exactly as written.</summary>
    public string? Text { get; private init; }

    public List<JsonTreeProperty> Properties { get; } = [];

    public List<JsonTree> Items { get; } = [];

    /// <summary>The first property with this name, or null.</summary>
    public JsonTreeProperty? Property(string name) => Properties.FirstOrDefault(p => p.Name == name);

    /// <summary>What this value is, for messages ("a string", "an object", …).</summary>
    public string Describe() => Kind switch
    {
        JsonTreeKind.Object => "an object",
        JsonTreeKind.Array => "a list",
        JsonTreeKind.String => $"the string \"{(Text!.Length <= 40 ? Text : Text[..40] + "…")}\"",
        JsonTreeKind.Number => $"the number {Text}",
        JsonTreeKind.True => "true",
        JsonTreeKind.False => "false",
        _ => "null",
    };

    /// <summary>Parses UTF-8 JSON text. On a syntax error returns null and sets <paramref name="error"/>.</summary>
    public static JsonTree? Parse(ReadOnlySpan<byte> utf8, out (string Message, int Line, int Column)? error)
    {
        error = null;
        if (utf8.StartsWith((ReadOnlySpan<byte>)[0xEF, 0xBB, 0xBF])) utf8 = utf8[3..];
        if (utf8.TrimStart(" \t\r\n"u8).IsEmpty)
        {
            error = ("the file is empty", 1, 1);
            return null;
        }
        var positions = new Utf8Positions(utf8);
        var reader = new Utf8JsonReader(utf8, new JsonReaderOptions
        {
            CommentHandling = JsonCommentHandling.Skip,
            AllowTrailingCommas = true,
            MaxDepth = 64,
        });
        try
        {
            if (!reader.Read())
            {
                error = ("the file is empty", 1, 1);
                return null;
            }
            JsonTree root = ReadValue(ref reader, positions);
            if (reader.Read())
            {
                (int line, int col) = positions.At(reader.TokenStartIndex);
                error = ("unexpected text after the end of the JSON value", line, col);
                return null;
            }
            return root;
        }
        catch (JsonException ex)
        {
            string message = ex.Message;
            int cut = message.IndexOf(" LineNumber:", StringComparison.Ordinal);
            if (cut > 0) message = message[..cut];
            message = message.TrimEnd('.', ' ');
            error = ("invalid JSON: " + message, (int)(ex.LineNumber ?? 0) + 1, (int)(ex.BytePositionInLine ?? 0) + 1);
            return null;
        }
    }

    private static JsonTree ReadValue(ref Utf8JsonReader reader, Utf8Positions positions)
    {
        (int line, int col) = positions.At(reader.TokenStartIndex);
        switch (reader.TokenType)
        {
            case JsonTokenType.StartObject:
            {
                var node = new JsonTree(JsonTreeKind.Object, line, col);
                while (reader.Read() && reader.TokenType != JsonTokenType.EndObject)
                {
                    (int pl, int pc) = positions.At(reader.TokenStartIndex);
                    string name = reader.GetString() ?? "";
                    reader.Read();
                    node.Properties.Add(new JsonTreeProperty(name, pl, pc, ReadValue(ref reader, positions)));
                }
                return node;
            }
            case JsonTokenType.StartArray:
            {
                var node = new JsonTree(JsonTreeKind.Array, line, col);
                while (reader.Read() && reader.TokenType != JsonTokenType.EndArray)
                {
                    node.Items.Add(ReadValue(ref reader, positions));
                }
                return node;
            }
            case JsonTokenType.String:
                return new JsonTree(JsonTreeKind.String, line, col) { Text = reader.GetString() };
            case JsonTokenType.Number:
                return new JsonTree(JsonTreeKind.Number, line, col) { Text = Encoding.UTF8.GetString(reader.ValueSpan) };
            case JsonTokenType.True:
                return new JsonTree(JsonTreeKind.True, line, col);
            case JsonTokenType.False:
                return new JsonTree(JsonTreeKind.False, line, col);
            default:
                return new JsonTree(JsonTreeKind.Null, line, col);
        }
    }
}

/// <summary>A property of a JSON object with the position of its name.</summary>
internal sealed record JsonTreeProperty(string Name, int Line, int Column, JsonTree Value);
