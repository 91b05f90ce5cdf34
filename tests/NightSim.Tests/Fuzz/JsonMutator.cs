using System.Globalization;
using System.Text;
using System.Text.Json;
using NightSim.Tests.Fixtures;

namespace NightSim.Tests.Fuzz;

/// <summary>
/// Turns a valid JSON input into a hostile one, deterministically from a <see cref="SeededRandom"/>: edits that know
/// the JSON structure (a value of the wrong type, a huge or odd number, a duplicated or missing key, a renamed key, a
/// repeated array element, deep nesting, odd Unicode in a string, two values swapped, everything on one line) and
/// edits of the raw bytes (flipped bits, invalid UTF-8, NUL, cut short, a byte-order mark, UTF-16). Each mutation
/// returns a one-line description of what it did, printed when a case fails.
/// </summary>
internal static class JsonMutator
{
    /// <summary>A value in the seed document: its byte span, its key's start (or -1 in an array or at the top).</summary>
    private readonly record struct Value(int Start, int End, JsonTokenType Kind, int KeyStart, int KeyEnd);

    private static readonly string[] s_numbers =
    [
        "1e308", "1e309", "-1e308", "1e999", "-1e999", "1e-400", "5e-324", "0", "-0", "-1", "0.0", "1.7976931348623157e308",
        "123456789012345678901234567890", "2147483648", "-2147483649", "9223372036854775808", "18446744073709551616",
        "1e6", "1e9", "1e12", "3660", "3661", "100000", "100001", "200001", "1000000", "0.5", "-1e-9", "1e-9", "4.9e-324",
        "NaN", "Infinity", "-Infinity", "0x10", "1e", "01", ".5", "1.", "+1", "1_000", "--1", "1e+308", "1E400",
    ];

    private static readonly string[] s_strings =
    [
        "", " ", "0", "-0", "gnd", "GND", "0k", "4k7k", "4kk7", "4.7.1k", "4K7", "4k7\u03A9", "4k7 ohm", "4 k7", "1e3k", "k", "-4k7",
        "4k7e99", "1e-999", "1e999", "1e308", "1e309", "-1e309", "NaN", "nan", "inf", "-inf", "Infinity", "1\u00B5", "1u", "4,7k", "1,5",
        "99999999999999999999T", "0.0000000000000000000000000001p", "\u221E", "\u0661\u0662", "\uFF14\uFF17", "10M", "10m", "1meg", "1 h",
        "90min", "1e9min", "-5min", "25:61", "24:00", "23:59:60", "-00:01", "12:00:00.5", "2026-02-30", "2026-13-01", "9999-12-31",
        "0001-01-01", "10000-01-01", "2026-11-20T99:99", "Europe/Nowhere", "UTC", "Etc/GMT+14", "Local", "../../../etc/passwd",
        "/dev/zero", "/dev/urandom", "/dev/null", "/", ".", "clear", "overcast", "storm", "push-pull", "open-collector",
        "resistor", "voltage-source", "relay", "timer-555", "luxPoints", "points", "pulse", "sine",
    ];

    private static readonly string[] s_otherTypes =
    [
        "null", "true", "false", "0", "-1", "1e999", "\"\"", "\"x\"", "[]", "{}", "[[]]", "{\"\":\"\"}", "[1,\"a\",null]",
        "{\"value\":\"1k\"}", "[\"a\",\"gnd\"]", "[\"a\",\"a\"]", "[\"gnd\",\"gnd\"]", "{\"a\":{\"b\":{\"c\":[]}}}",
    ];

    private static readonly string[] s_insertions =
    [
        "\\u0000", "\\ud800", "\\udc00", "\\ud83d\\ude00", "\U0001F600", "\\u202e", "\u202E", "\\u001b[31m", "\t", "\\\"", "\\\\", "\\n",
        "\u007F", "\\uffff", "\uFFFE", "\u0301", "\u0085", "\u2028", "%s%n", "{0}", "'", "</script>", "<svg onload=x>", "]]>", "&amp;",
        "\u0430", "\u00A0", "\u200B", "\uFEFF", "\\u0007", "\r", "\\r\\n", "\\/", "\u00E9", "e\u0301",
    ];

    private static readonly string[] s_keys =
    [
        "", " ", "\\u0000", "__proto__", "$schema", "constructor", "id", "kind", "nodes", "pins", "value", "parts", "events", "site",
        "name", "start", "nights", "seed", "times", "perHour", "minutes", "flashesPerMinute", "lightLog", "targets", "\u0430",
    ];

    /// <summary>Applies 1 to 3 mutations to <paramref name="seed"/> (valid JSON); returns the bytes and what was done.</summary>
    public static (byte[] Bytes, string Description) Mutate(byte[] seed, SeededRandom rng, IReadOnlyList<byte[]> others)
    {
        double pick = rng.NextDouble();
        if (pick < 0.03) return Whole(rng, others);
        var notes = new List<string>();
        byte[] bytes = seed;
        if (pick < 0.80)
        {
            List<Value> values = Scan(seed);
            int count = 1 + (int)rng.NextInt(3);
            var edits = new List<(int Start, int End, byte[] With)>();
            for (int i = 0; i < count && values.Count > 0; i++)
            {
                if (Structural(seed, values, rng, others) is { } edit && !edits.Any(e => edit.Start < e.End && e.Start < edit.End
                        || (edit.Start == edit.End && edit.Start >= e.Start && edit.Start <= e.End)
                        || (e.Start == e.End && e.Start >= edit.Start && e.Start <= edit.End)))
                {
                    edits.Add((edit.Start, edit.End, edit.With));
                    notes.Add(edit.Note);
                }
            }
            bytes = Apply(seed, edits);
            if (rng.NextDouble() < 0.05)
            {
                bytes = OneLine(bytes);
                notes.Add("all on one line");
            }
        }
        if (pick >= 0.80 || rng.NextDouble() < 0.1)
        {
            (bytes, string note) = Raw(bytes, rng);
            notes.Add(note);
        }
        return (bytes, string.Join("; ", notes));
    }

    /// <summary>Every value of a valid JSON document with its span and key span.</summary>
    private static List<Value> Scan(byte[] json)
    {
        var values = new List<Value>();
        var reader = new Utf8JsonReader(json, new JsonReaderOptions
        {
            CommentHandling = JsonCommentHandling.Skip,
            AllowTrailingCommas = true,
            MaxDepth = 256,
        });
        var open = new Stack<(int Start, int KeyStart, int KeyEnd)>();
        int keyStart = -1, keyEnd = -1;
        while (TryRead(ref reader))
        {
            int start = (int)reader.TokenStartIndex;
            switch (reader.TokenType)
            {
                case JsonTokenType.PropertyName:
                    keyStart = start;
                    keyEnd = (int)reader.BytesConsumed;
                    break;
                case JsonTokenType.StartObject or JsonTokenType.StartArray:
                    open.Push((start, keyStart, keyEnd));
                    keyStart = keyEnd = -1;
                    break;
                case JsonTokenType.EndObject or JsonTokenType.EndArray:
                    (int s, int ks, int ke) = open.Pop();
                    values.Add(new Value(s, (int)reader.BytesConsumed,
                        reader.TokenType == JsonTokenType.EndObject ? JsonTokenType.StartObject : JsonTokenType.StartArray, ks, ke));
                    break;
                default:
                    values.Add(new Value(start, (int)reader.BytesConsumed, reader.TokenType, keyStart, keyEnd));
                    keyStart = keyEnd = -1;
                    break;
            }
        }
        return values;
    }

    /// <summary>Reads the next token; false at the end or at a syntax error (a seed may hold mistakes on purpose).</summary>
    private static bool TryRead(ref Utf8JsonReader reader)
    {
        try
        {
            return reader.Read();
        }
        catch (JsonException)
        {
            return false;
        }
    }

    private static byte[] U(string s) => Encoding.UTF8.GetBytes(s);

    private static string Show(byte[] json, int start, int end)
    {
        string s = Encoding.UTF8.GetString(json, start, Math.Min(end - start, 60));
        return end - start > 60 ? s + "…" : s;
    }

    private static T Pick<T>(IReadOnlyList<T> list, SeededRandom rng) => list[(int)rng.NextInt(list.Count)];

    /// <summary>One edit that knows the structure; null when the picked value does not suit it.</summary>
    private static (int Start, int End, byte[] With, string Note)? Structural(byte[] json, List<Value> values, SeededRandom rng, IReadOnlyList<byte[]> others)
    {
        Value v = Pick(values, rng);
        string at = $"at byte {v.Start} ({Show(json, v.KeyStart >= 0 ? v.KeyStart : v.Start, v.End)})";
        var inv = CultureInfo.InvariantCulture;
        switch (rng.NextInt(14))
        {
            case 0 or 1:
            {
                string n = Pick(s_numbers, rng);
                return (v.Start, v.End, U(n), $"value {at} → number {n}");
            }
            case 2 or 3:
            {
                string s = Pick(s_strings, rng);
                return (v.Start, v.End, U(JsonSerializer.Serialize(s)), $"value {at} → string {JsonSerializer.Serialize(s)}");
            }
            case 4:
            {
                string t = Pick(s_otherTypes, rng);
                return (v.Start, v.End, U(t), $"value {at} → {t}");
            }
            case 5 when v.KeyStart >= 0:
            {
                // The same key twice: the second copy of the whole member after the first.
                byte[] member = json[v.KeyStart..v.End];
                return (v.End, v.End, [.. U(", "), .. member], $"key duplicated {at}");
            }
            case 6:
            {
                (int s, int e) = Widen(json, v.KeyStart >= 0 ? v.KeyStart : v.Start, v.End);
                return (s, e, [], $"removed {at}");
            }
            case 7 when v.KeyStart >= 0:
            {
                string key = rng.NextDouble() < 0.1 ? new string('k', 10_000) : Pick(s_keys, rng);
                string original = Encoding.UTF8.GetString(json, v.KeyStart + 1, v.KeyEnd - v.KeyStart - 2);
                if (rng.NextDouble() < 0.4 && original.Length > 1)
                {
                    int i = (int)rng.NextInt(original.Length);
                    key = rng.NextDouble() < 0.5 ? original.Remove(i, 1) : original.ToUpperInvariant();
                }
                return (v.KeyStart, v.KeyEnd, U("\"" + key + "\""), $"key renamed {at} → \"{(key.Length > 40 ? key[..40] + "…" : key)}\"");
            }
            case 8 when v.KeyStart < 0 && v.Start > 0:
            {
                // An array element repeated: many parts, many events, many points.
                int times = (int)Pick<long>([1, 2, 10, 100, 1000, 3000], rng);
                byte[] element = json[v.Start..v.End];
                var sb = new List<byte>(element.Length * times + times * 2);
                for (int i = 0; i < times; i++) { sb.Add((byte)','); sb.AddRange(element); }
                return (v.End, v.End, [.. sb], string.Create(inv, $"element {at} repeated {times} times"));
            }
            case 9:
            {
                int depth = (int)Pick<long>([10, 63, 64, 65, 200, 10_000, 100_000], rng);
                bool arrays = rng.NextDouble() < 0.6;
                string open = arrays ? "[" : "{\"a\":", close = arrays ? "]" : "}";
                var sb = new StringBuilder(depth * 5);
                for (int i = 0; i < depth; i++) sb.Append(open);
                sb.Append('1');
                for (int i = 0; i < depth; i++) sb.Append(close);
                return (v.Start, v.End, U(sb.ToString()), string.Create(inv, $"value {at} nested {depth} deep"));
            }
            case 10 when v.Kind == JsonTokenType.String:
            {
                string ins = Pick(s_insertions, rng);
                int inside = v.End - v.Start - 2;
                int pos = v.Start + 1 + (inside > 0 ? (int)rng.NextInt(inside + 1) : 0);
                // Keep a UTF-8 sequence whole: move back to the start of a character.
                while (pos > v.Start + 1 && (json[pos] & 0xC0) == 0x80) pos--;
                return (pos, pos, U(ins), $"string {at} gets {JsonSerializer.Serialize(ins)}");
            }
            case 11 when v.Kind == JsonTokenType.String:
            {
                int length = (int)Pick<long>([1000, 100_000, 1_000_000], rng);
                return (v.Start, v.End, U("\"" + new string('x', length) + "\""), string.Create(inv, $"string {at} → {length} characters"));
            }
            case 12:
            {
                // Another value of the same file in its place: right syntax, wrong meaning.
                Value w = Pick(values, rng);
                return (v.Start, v.End, json[w.Start..w.End], $"value {at} → copy of value at byte {w.Start} ({Show(json, w.Start, w.End)})");
            }
            case 13 when others.Count > 0:
            {
                // A value from another input file (a scenario's events in a netlist, a part in a scenario, …).
                byte[] other = Pick(others, rng);
                List<Value> theirs = Scan(other);
                if (theirs.Count == 0) return null;
                Value w = Pick(theirs, rng);
                return (v.Start, v.End, other[w.Start..w.End], $"value {at} → value from another file ({Show(other, w.Start, w.End)})");
            }
        }
        return null;
    }

    /// <summary>A member or element span widened over one neighbouring comma, so removing it leaves valid JSON.</summary>
    private static (int Start, int End) Widen(byte[] json, int start, int end)
    {
        int after = end;
        while (after < json.Length && json[after] is (byte)' ' or (byte)'\n' or (byte)'\r' or (byte)'\t') after++;
        if (after < json.Length && json[after] == ',') return (start, after + 1);
        int before = start - 1;
        while (before >= 0 && json[before] is (byte)' ' or (byte)'\n' or (byte)'\r' or (byte)'\t') before--;
        if (before >= 0 && json[before] == ',') return (before, end);
        return (start, end);
    }

    private static byte[] Apply(byte[] json, List<(int Start, int End, byte[] With)> edits)
    {
        var result = new List<byte>(json.Length + edits.Sum(e => e.With.Length));
        int at = 0;
        foreach (var (start, end, with) in edits.OrderBy(e => e.Start).ThenBy(e => e.End))
        {
            if (start < at) continue;
            result.AddRange(json.AsSpan(at, start - at));
            result.AddRange(with);
            at = end;
        }
        result.AddRange(json.AsSpan(at));
        return [.. result];
    }

    private static byte[] OneLine(byte[] json) => [.. json.Select(b => b is (byte)'\n' or (byte)'\r' ? (byte)' ' : b)];

    /// <summary>Edits of the raw bytes.</summary>
    public static (byte[] Bytes, string Note) Raw(byte[] bytes, SeededRandom rng)
    {
        var inv = CultureInfo.InvariantCulture;
        int n = bytes.Length;
        int Pos() => n == 0 ? 0 : (int)rng.NextInt(n + 1);
        switch (rng.NextInt(12))
        {
            case 0:
            {
                byte[] b = [.. bytes];
                int flips = 1 + (int)rng.NextInt(8);
                for (int i = 0; i < flips && n > 0; i++) b[rng.NextInt(n)] ^= (byte)(1 << (int)rng.NextInt(8));
                return (b, string.Create(inv, $"{flips} bits flipped"));
            }
            case 1:
            {
                int p = Pos();
                byte[][] bad = [[0xFF], [0xFE], [0xC0, 0xAF], [0xC2], [0x80], [0xED, 0xA0, 0x80], [0xF4, 0x90, 0x80, 0x80], [0xE9], [0x00], [0xEF, 0xBF, 0xBE]];
                byte[] ins = Pick(bad, rng);
                return ([.. bytes[..p], .. ins, .. bytes[p..]], string.Create(inv, $"bytes {Convert.ToHexString(ins)} inserted at {p}"));
            }
            case 2:
            {
                int p = Pos();
                return (bytes[..p], string.Create(inv, $"cut short at byte {p} of {n}"));
            }
            case 3:
            {
                int a = Pos(), b = Pos();
                (a, b) = (Math.Min(a, b), Math.Max(a, b));
                return ([.. bytes[..a], .. bytes[b..]], string.Create(inv, $"bytes {a}…{b} deleted"));
            }
            case 4:
            {
                int a = Pos(), b = Pos();
                (a, b) = (Math.Min(a, b), Math.Max(a, b));
                return ([.. bytes[..b], .. bytes[a..b], .. bytes[b..]], string.Create(inv, $"bytes {a}…{b} doubled"));
            }
            case 5:
            {
                int p = Pos();
                byte c = (byte)"{}[]:,\"\\/*"[(int)rng.NextInt(10)];
                return ([.. bytes[..p], c, .. bytes[p..]], string.Create(inv, $"'{(char)c}' inserted at {p}"));
            }
            case 6:
                return ([0xEF, 0xBB, 0xBF, .. bytes], "UTF-8 byte-order mark added");
            case 7:
                return (rng.NextDouble() < 0.5 ? [0xFF, 0xFE, .. Encoding.Convert(Encoding.UTF8, Encoding.Unicode, bytes)]
                    : Encoding.Convert(Encoding.UTF8, Encoding.Unicode, bytes), "saved as UTF-16");
            case 8:
                return ([.. Encoding.UTF8.GetBytes(Encoding.UTF8.GetString(bytes).ReplaceLineEndings(rng.NextDouble() < 0.5 ? "\r\n" : "\r"))], "line ends changed");
            case 9:
            {
                int p = Pos();
                string comment = Pick(["// c\n", "/* c */", "/*", "//", "#", "/* nested /* */ */"], rng);
                return ([.. bytes[..p], .. U(comment), .. bytes[p..]], string.Create(inv, $"comment {JsonSerializer.Serialize(comment)} at {p}"));
            }
            case 10:
            {
                byte[] b = [.. bytes];
                int count = 1 + (int)rng.NextInt(16);
                for (int i = 0; i < count && n > 0; i++) b[rng.NextInt(n)] = (byte)rng.NextInt(256);
                return (b, string.Create(inv, $"{count} random bytes"));
            }
            default:
            {
                int p = Pos();
                string ins = Pick([" ", "\n", "\u00A0", "\uFEFF", "\t", "\v", "\f", "\u2028"], rng);
                return ([.. bytes[..p], .. U(ins), .. bytes[p..]], string.Create(inv, $"whitespace {JsonSerializer.Serialize(ins)} at {p}"));
            }
        }
    }

    /// <summary>A whole file that is something else.</summary>
    private static (byte[] Bytes, string Description) Whole(SeededRandom rng, IReadOnlyList<byte[]> others)
    {
        switch (rng.NextInt(8))
        {
            case 0: return ([], "empty file");
            case 1: return (U("   \n\t "), "only whitespace");
            case 2: return (U(Pick(["null", "0", "\"x\"", "[]", "true", "1e999", "{}", "[{}]"], rng)), "a bare value");
            case 3: return (U(new string('[', 100_000)), "100 000 open brackets");
            case 4: return ([.. U(new string(' ', 2_000_000)), .. U("{}")], "2 MB of spaces, then {}");
            case 5:
            {
                byte[] b = new byte[1 + rng.NextInt(4096)];
                for (int i = 0; i < b.Length; i++) b[i] = (byte)rng.NextInt(256);
                return (b, $"{b.Length} random bytes");
            }
            case 6 when others.Count > 0: return (Pick(others, rng), "another input file in its place");
            default: return (U("{\"a\":" + new string('1', 100_000) + "}"), "a number of 100 000 digits");
        }
    }
}
