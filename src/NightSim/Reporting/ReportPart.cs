using System.Globalization;
using System.Security.Cryptography;
using System.Text;
using NightSim.Devices;
using NightSim.Netlist;
using NightSim.Units;

namespace NightSim.Reporting;

/// <summary>One part of the circuit as the report lists it: id, kind, connections and values.</summary>
/// <param name="Id">Part id ("R1").</param>
/// <param name="Kind">Part kind ("resistor").</param>
/// <param name="Connections">Pin → node, in the kind's pin order ("a" → "vcc"); two-terminal parts list their pins too.</param>
/// <param name="Values">Parameter → value with unit ("value" → "4.7 kΩ"), only those that differ from the kind's
/// defaults (the hash covers every value).</param>
public sealed record ReportPart(string Id, string Kind, IReadOnlyList<KeyValuePair<string, string>> Connections,
    IReadOnlyList<KeyValuePair<string, string>> Values)
{
    /// <summary>The parts of <paramref name="net"/> in netlist order.</summary>
    public static IReadOnlyList<ReportPart> List(NetlistDefinition net) => [.. net.Parts.Select(Of)];

    /// <summary>SHA-256 (lower-case hex) over every part's id, kind, connections and every parameter value (defaults
    /// included, 12 significant digits), parts sorted by id: comments, layout and order in the file do not change it.</summary>
    public static string Hash(NetlistDefinition net)
    {
        var text = new StringBuilder();
        foreach (PartDefinition p in net.Parts.OrderBy(p => p.Id, StringComparer.Ordinal))
        {
            text.Append(p.Id).Append('|').Append(p.Kind);
            foreach (KeyValuePair<string, string> pin in p.Pins.OrderBy(x => x.Key, StringComparer.Ordinal))
                text.Append('|').Append(pin.Key).Append('=').Append(pin.Value);
            foreach (string name in p.Parameters.Names.Order(StringComparer.Ordinal))
                text.Append('|').Append(name).Append('=').Append(Canonical(p.Parameters, name));
            text.Append('\n');
        }
        return Convert.ToHexStringLower(SHA256.HashData(Encoding.UTF8.GetBytes(text.ToString())));
    }

    private static ReportPart Of(PartDefinition p)
    {
        PartKind? kind = PartCatalog.Find(p.Kind);
        IEnumerable<string> pins = kind is null ? p.Pins.Keys : kind.Pins.Where(p.Pins.ContainsKey);
        var connections = pins.Select(pin => new KeyValuePair<string, string>(pin, p.Pins[pin])).ToList();
        var values = new List<KeyValuePair<string, string>>();
        IEnumerable<ParameterSpec> specs = kind?.Parameters ?? [];
        foreach (ParameterSpec spec in specs)
        {
            if (!p.Parameters.Has(spec.Name)) continue;
            string? shown = Shown(p.Parameters, spec);
            if (shown is not null) values.Add(new(spec.Name, shown));
        }
        return new ReportPart(p.Id, p.Kind, connections, values);
    }

    /// <summary>The value as shown, or null when it is the kind's default.</summary>
    private static string? Shown(PartParameters parameters, ParameterSpec spec)
    {
        switch (spec.Type)
        {
            case ParameterType.Number:
                double v = parameters.Number(spec.Name);
                return spec.Default is double d && d == v ? null : EngineeringValue.Format(v, spec.Unit);
            case ParameterType.Text:
                string t = parameters.Text(spec.Name);
                return spec.DefaultText == t ? null : t;
            case ParameterType.Boolean:
                return parameters.Flag(spec.Name) ? "yes" : "no";
            case ParameterType.Points:
                int n = parameters.Points(spec.Name)?.Count ?? 0;
                return n.ToString(CultureInfo.InvariantCulture) + (n == 1 ? " point" : " points");
            case ParameterType.Object:
                PartParameters? o = parameters.Object(spec.Name);
                if (o is null) return null;
                IEnumerable<string> fields = (spec.Fields ?? []).Where(f => o.Has(f.Name))
                    .Select(f => f.Name + " " + (Shown(o, f with { Default = null, DefaultText = null }) ?? ""));
                return string.Join(", ", fields);
            default:
                return null;
        }
    }

    private static string Canonical(PartParameters parameters, string name)
    {
        // 12 significant digits: "100n" and "0.1u" are the same value (their doubles differ in the last bit).
        if (parameters.OptionalNumber(name) is double v) return v.ToString("G12", CultureInfo.InvariantCulture);
        if (parameters.Points(name) is { } pts) return string.Join(";", pts.Select(x => string.Create(CultureInfo.InvariantCulture, $"{x.X:G12},{x.Y:G12}")));
        if (parameters.Object(name) is { } o) return "{" + string.Join("|", o.Names.Order(StringComparer.Ordinal).Select(n => n + "=" + Canonical(o, n))) + "}";
        string text = parameters.Text(name, "\u0000");
        if (text != "\u0000") return text;
        return parameters.Flag(name) ? "true" : "false";
    }
}
