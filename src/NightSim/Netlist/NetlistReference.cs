using System.Text;
using NightSim.Devices;
using NightSim.Units;

namespace NightSim.Netlist;

/// <summary>
/// Generates the part-kind reference (Markdown) from <see cref="PartCatalog"/>: pins, every parameter with unit,
/// range and default, and the kind's notes (a caution). The committed copy is docs/part-kinds.md; regenerate it with
/// <c>nightsim check --write-kinds docs/part-kinds.md</c>.
/// </summary>
public static class NetlistReference
{
    /// <summary>The reference text ("\n" line ends, trailing newline).</summary>
    public static string Markdown()
    {
        var sb = new StringBuilder();
        sb.Append("# Part kinds\n\n");
        sb.Append("Generated from the part catalogue by `nightsim check --write-kinds docs/part-kinds.md`; do not edit by hand.\n");
        sb.Append("Numbers take engineering notation (\"4k7\", \"100n\", \"2.2M\"; m is milli, M is mega) and an optional unit.\n");
        sb.Append("The format itself is described in [netlist-format.md](netlist-format.md).\n\n");
        sb.Append("| kind | pins | description |\n|---|---|---|\n");
        foreach (PartKind kind in PartCatalog.All)
        {
            sb.Append($"| [`{kind.Name}`](#{kind.Name}) | {PinsText(kind)} | {Escape(kind.Description)} |\n");
        }
        foreach (PartKind kind in PartCatalog.All)
        {
            sb.Append($"\n## {kind.Name}\n\n{kind.Description}\n\n");
            sb.Append(kind.UsesNodeList
                ? $"Pins: `\"nodes\": [{string.Join(", ", kind.Pins.Select(p => "\"" + p + "\""))}]` (node names in this order).\n"
                : $"Pins: `\"pins\": {{ {string.Join(", ", kind.Pins.Select(p => $"\"{p}\": …"))} }}`"
                  + (kind.OptionalPins.Count > 0 ? $" (optional: {string.Join(", ", kind.OptionalPins)})" : "") + ".\n");
            sb.Append("\n| parameter | type | unit | range | default | description |\n|---|---|---|---|---|---|\n");
            foreach (ParameterSpec p in kind.Parameters) AppendRow(sb, p, "");
            List<string> groups = kind.Parameters.Where(p => p.ExclusiveGroup is not null).Select(p => p.ExclusiveGroup!).Distinct().ToList();
            foreach (string g in groups)
            {
                sb.Append($"\nGive at most one of {string.Join(", ", kind.Parameters.Where(p => p.ExclusiveGroup == g).Select(p => "`" + p.Name + "`"))}.\n");
            }
            if (kind.Notes is string notes) sb.Append($"\n{notes}\n");
        }
        return sb.ToString();
    }

    private static string PinsText(PartKind kind) => kind.UsesNodeList
        ? "nodes: " + string.Join(", ", kind.Pins)
        : "pins: " + string.Join(", ", kind.Pins);

    private static void AppendRow(StringBuilder sb, ParameterSpec p, string prefix)
    {
        string type = p.Type switch
        {
            ParameterType.Number => "number",
            ParameterType.Text => p.Choices is { Count: > 0 } c ? string.Join(" \\| ", c.Select(x => "`" + x + "`")) : "text",
            ParameterType.Boolean => "true/false",
            ParameterType.Points => $"[[{(p.PointsXUnit == "s" ? "t" : "x")}, value], …]",
            _ => "object",
        };
        string unit = p.Type == ParameterType.Points ? $"{p.PointsXUnit}, {(p.Unit.Length > 0 ? p.Unit : "—")}" : p.Unit.Length > 0 ? p.Unit : "—";
        bool hasMin = !double.IsNegativeInfinity(p.Min), hasMax = !double.IsPositiveInfinity(p.Max);
        string range = !hasMin && !hasMax ? "" : $"{(hasMin ? EngineeringValue.Format(p.Min, p.Unit) : "−∞")} … {(hasMax ? EngineeringValue.Format(p.Max, p.Unit) : "∞")}";
        string def = p.Required ? "**required**" : p.Default is { } d ? EngineeringValue.Format(d, p.Unit) : p.DefaultText ?? "";
        sb.Append($"| `{prefix}{p.Name}` | {type} | {unit} | {range} | {def} | {Escape(p.Description)} |\n");
        if (p.Type == ParameterType.Object)
        {
            foreach (ParameterSpec f in p.Fields ?? []) AppendRow(sb, f, prefix + p.Name + ".");
        }
    }

    private static string Escape(string text) => text.Replace("|", "\\|", StringComparison.Ordinal);
}
