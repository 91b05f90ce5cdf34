using System.Text.Json;

namespace NightSim.Text;

/// <summary>
/// Finds a JSON string or key whose escapes do not make text: a <c>\uD800</c>…<c>\uDFFF</c> escape that is half of a
/// UTF-16 surrogate pair without its other half (RFC 8259 §8.2 allows it in the grammar; it is no character). The
/// JSON readers refuse such a string only when it is read, with a message that names no place; this check names
/// the line and column first.
/// </summary>
public static class JsonEscapeCheck
{
    /// <summary>Null when every escaped string in <paramref name="utf8"/> decodes to text (or the JSON does not parse:
    /// the parser reports that), else where the first one that does not stands.</summary>
    public static Utf8Check.Finding? Problem(ReadOnlySpan<byte> utf8)
    {
        if (utf8.StartsWith((ReadOnlySpan<byte>)[0xEF, 0xBB, 0xBF])) utf8 = utf8[3..];
        var reader = new Utf8JsonReader(utf8, new JsonReaderOptions
        {
            CommentHandling = JsonCommentHandling.Skip,
            AllowTrailingCommas = true,
            MaxDepth = 64,
        });
        try
        {
            while (reader.Read())
            {
                if (reader.TokenType is not (JsonTokenType.String or JsonTokenType.PropertyName) || !reader.ValueIsEscaped) continue;
                try
                {
                    _ = reader.GetString();
                }
                catch (InvalidOperationException)
                {
                    long at = reader.TokenStartIndex;
                    (int line, int column) = new Utf8Positions(utf8).At(at);
                    string what = reader.TokenType == JsonTokenType.PropertyName ? "key" : "string";
                    return new Utf8Check.Finding(at, line, column,
                        $"the {what} here holds a \\u escape between \\ud800 and \\udfff without its other half: half a character, not text",
                        "write the character itself, or both halves of the pair (e.g. \\ud83d\\ude00); remove the escape if it is a mistake");
                }
            }
        }
        catch (JsonException)
        {
            // A syntax error: the parser that follows reports it with its place.
        }
        return null;
    }
}
