using System.Text;
using System.Text.Encodings.Web;
using System.Text.Json;
using NightSim.Devices;

namespace NightSim.Netlist;

/// <summary>
/// Generates the JSON Schema (draft 2020-12) of the netlist format from <see cref="PartCatalog"/>, so editors can
/// validate and complete netlists. The committed copy is netlists/netlist.schema.json; regenerate it with
/// <c>nightsim check --write-schema netlists/netlist.schema.json</c> after adding or changing a part kind.
/// </summary>
public static class NetlistSchema
{
    /// <summary>Pattern of an engineering value written as a string: number, optional prefix/decimal letter, unit.</summary>
    public const string EngineeringPattern = @"^\s*[+-]?([0-9]+([.][0-9]*)?|[.][0-9]+)([eE][+-]?[0-9]+)?\s*[A-Za-zµμΩ°%]*[0-9]*\s*[A-Za-zµμΩ°%]*\s*$|^\s*[+]?(inf|infinity|∞)\s*$";

    /// <summary>The schema text (UTF-8 JSON, two-space indent, "\n" line ends, trailing newline).</summary>
    public static string Generate()
    {
        var buffer = new MemoryStream();
        using (var w = new Utf8JsonWriter(buffer, new JsonWriterOptions
        {
            Indented = true,
            IndentSize = 2,
            NewLine = "\n",
            Encoder = JavaScriptEncoder.UnsafeRelaxedJsonEscaping,
        }))
        {
            w.WriteStartObject();
            w.WriteString("$schema", "https://json-schema.org/draft/2020-12/schema");
            w.WriteString("$id", "https://nightsim.invalid/netlist.schema.json");
            w.WriteString("title", "NightSim netlist");
            w.WriteString("description", "A circuit for NightSim: a name, an optional description and its parts. Generated from the part catalogue; do not edit by hand.");
            w.WriteString("type", "object");
            WriteStrings(w, "required", ["name", "parts"]);
            w.WriteBoolean("additionalProperties", false);
            w.WriteStartObject("properties");
            w.WriteStartObject("$schema");
            w.WriteString("type", "string");
            w.WriteString("description", "Path or URL of this schema, e.g. \"./netlist.schema.json\".");
            w.WriteEndObject();
            w.WriteStartObject("name");
            w.WriteString("type", "string");
            w.WriteNumber("minLength", 1);
            w.WriteString("description", "Circuit name.");
            w.WriteEndObject();
            w.WriteStartObject("description");
            w.WriteString("type", "string");
            w.WriteString("description", "Free text about the circuit.");
            w.WriteEndObject();
            w.WriteStartObject("parts");
            w.WriteString("type", "array");
            w.WriteNumber("minItems", 1);
            w.WriteString("description", "The parts of the circuit.");
            w.WriteStartObject("items");
            w.WriteString("$ref", "#/$defs/part");
            w.WriteEndObject();
            w.WriteEndObject();
            w.WriteEndObject();

            w.WriteStartObject("$defs");
            w.WriteStartObject("node");
            w.WriteString("type", "string");
            w.WriteNumber("minLength", 1);
            w.WriteString("description", "Node name; ground is \"gnd\".");
            w.WriteEndObject();
            w.WriteStartObject("engineeringValue");
            w.WriteString("description", "A number, or a string in engineering notation with an optional unit: \"4k7\", \"100n\", \"2.2M\", \"3300uF\" (m is milli, M is mega).");
            w.WriteStartArray("anyOf");
            w.WriteStartObject();
            w.WriteString("type", "number");
            w.WriteEndObject();
            w.WriteStartObject();
            w.WriteString("type", "string");
            w.WriteString("pattern", EngineeringPattern);
            w.WriteEndObject();
            w.WriteEndArray();
            w.WriteEndObject();

            w.WriteStartObject("part");
            w.WriteString("type", "object");
            WriteStrings(w, "required", ["id", "kind"]);
            w.WriteStartObject("properties");
            w.WriteStartObject("id");
            w.WriteString("type", "string");
            w.WriteNumber("minLength", 1);
            w.WriteString("description", "Part id, unique in the netlist, e.g. \"R1\".");
            w.WriteEndObject();
            w.WriteStartObject("kind");
            w.WriteString("description", "Part kind.");
            WriteStrings(w, "enum", PartCatalog.All.Select(k => k.Name));
            w.WriteEndObject();
            w.WriteEndObject();
            w.WriteStartArray("allOf");
            foreach (PartKind kind in PartCatalog.All)
            {
                w.WriteStartObject();
                w.WriteStartObject("if");
                WriteStrings(w, "required", ["kind"]);
                w.WriteStartObject("properties");
                w.WriteStartObject("kind");
                w.WriteString("const", kind.Name);
                w.WriteEndObject();
                w.WriteEndObject();
                w.WriteEndObject();
                w.WriteStartObject("then");
                w.WriteString("$ref", "#/$defs/kind-" + kind.Name);
                w.WriteEndObject();
                w.WriteEndObject();
            }
            w.WriteEndArray();
            w.WriteEndObject();

            foreach (PartKind kind in PartCatalog.All)
            {
                WriteKind(w, kind);
            }
            w.WriteEndObject();
            w.WriteEndObject();
        }
        return Encoding.UTF8.GetString(buffer.ToArray()) + "\n";
    }

    private static void WriteKind(Utf8JsonWriter w, PartKind kind)
    {
        w.WriteStartObject("kind-" + kind.Name);
        w.WriteString("description", kind.Description);
        w.WriteString("type", "object");
        var required = new List<string> { "id", "kind", kind.UsesNodeList ? "nodes" : "pins" };
        required.AddRange(kind.Parameters.Where(p => p.Required).Select(p => p.Name));
        WriteStrings(w, "required", required);
        w.WriteBoolean("additionalProperties", false);
        w.WriteStartObject("properties");
        w.WriteStartObject("id");
        w.WriteString("type", "string");
        w.WriteEndObject();
        w.WriteStartObject("kind");
        w.WriteString("const", kind.Name);
        w.WriteEndObject();
        if (kind.UsesNodeList)
        {
            w.WriteStartObject("nodes");
            w.WriteString("description", "Nodes in pin order: " + string.Join(", ", kind.Pins) + ".");
            w.WriteString("type", "array");
            w.WriteNumber("minItems", kind.Pins.Count);
            w.WriteNumber("maxItems", kind.Pins.Count);
            w.WriteStartObject("items");
            w.WriteString("$ref", "#/$defs/node");
            w.WriteEndObject();
            w.WriteEndObject();
        }
        else
        {
            w.WriteStartObject("pins");
            w.WriteString("description", "Pin name → node.");
            w.WriteString("type", "object");
            WriteStrings(w, "required", kind.Pins.Where(p => !kind.OptionalPins.Contains(p)));
            w.WriteBoolean("additionalProperties", false);
            w.WriteStartObject("properties");
            foreach (string pin in kind.Pins)
            {
                w.WriteStartObject(pin);
                w.WriteString("$ref", "#/$defs/node");
                w.WriteEndObject();
            }
            w.WriteEndObject();
            w.WriteEndObject();
        }
        foreach (ParameterSpec p in kind.Parameters)
        {
            WriteParameter(w, p);
        }
        w.WriteEndObject();
        List<List<string>> exclusive = kind.Parameters.Where(p => p.ExclusiveGroup is not null)
            .GroupBy(p => p.ExclusiveGroup!).Select(g => g.Select(p => p.Name).ToList()).Where(g => g.Count > 1).ToList();
        if (exclusive.Count > 0)
        {
            w.WriteStartArray("allOf");
            foreach (List<string> group in exclusive)
            {
                // At most one of the group: "not" any pair of them together.
                w.WriteStartObject();
                w.WriteStartObject("not");
                w.WriteStartArray("anyOf");
                for (int i = 0; i < group.Count; i++)
                {
                    for (int j = i + 1; j < group.Count; j++)
                    {
                        w.WriteStartObject();
                        WriteStrings(w, "required", [group[i], group[j]]);
                        w.WriteEndObject();
                    }
                }
                w.WriteEndArray();
                w.WriteEndObject();
                w.WriteEndObject();
            }
            w.WriteEndArray();
        }
        w.WriteEndObject();
    }

    private static void WriteParameter(Utf8JsonWriter w, ParameterSpec p)
    {
        w.WriteStartObject(p.Name);
        w.WriteString("description", Describe(p));
        switch (p.Type)
        {
            case ParameterType.Number:
                w.WriteString("$ref", "#/$defs/engineeringValue");
                break;
            case ParameterType.Text:
                w.WriteString("type", "string");
                if (p.Choices is { Count: > 0 }) WriteStrings(w, "enum", p.Choices);
                break;
            case ParameterType.Boolean:
                w.WriteString("type", "boolean");
                break;
            case ParameterType.Points:
                w.WriteString("type", "array");
                w.WriteNumber("minItems", 1);
                w.WriteStartObject("items");
                w.WriteString("type", "array");
                w.WriteNumber("minItems", 2);
                w.WriteNumber("maxItems", 2);
                w.WriteStartObject("items");
                w.WriteString("$ref", "#/$defs/engineeringValue");
                w.WriteEndObject();
                w.WriteEndObject();
                break;
            case ParameterType.Object:
                w.WriteString("type", "object");
                WriteStrings(w, "required", (p.Fields ?? []).Where(f => f.Required).Select(f => f.Name));
                w.WriteBoolean("additionalProperties", false);
                w.WriteStartObject("properties");
                foreach (ParameterSpec f in p.Fields ?? [])
                {
                    WriteParameter(w, f);
                }
                w.WriteEndObject();
                break;
        }
        w.WriteEndObject();
    }

    private static string Describe(ParameterSpec p)
    {
        var sb = new StringBuilder(p.Description);
        if (p.Type == ParameterType.Number)
        {
            if (p.Unit.Length > 0) sb.Append(" Unit: ").Append(p.Unit).Append('.');
            bool hasMin = !double.IsNegativeInfinity(p.Min), hasMax = !double.IsPositiveInfinity(p.Max);
            if (hasMin || hasMax)
            {
                sb.Append(" Range: ")
                    .Append(hasMin ? Units.EngineeringValue.Format(p.Min, p.Unit) : "−∞")
                    .Append(" … ")
                    .Append(hasMax ? Units.EngineeringValue.Format(p.Max, p.Unit) : "∞")
                    .Append('.');
            }
            if (p.Default is { } d) sb.Append(" Default: ").Append(Units.EngineeringValue.Format(d, p.Unit)).Append('.');
        }
        if (p.DefaultText is { } t) sb.Append(" Default: ").Append(t).Append('.');
        if (p.Required) sb.Append(" Required.");
        return sb.ToString();
    }

    private static void WriteStrings(Utf8JsonWriter w, string name, IEnumerable<string> values)
    {
        w.WriteStartArray(name);
        foreach (string v in values) w.WriteStringValue(v);
        w.WriteEndArray();
    }
}
