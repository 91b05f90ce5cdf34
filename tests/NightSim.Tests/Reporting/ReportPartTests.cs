using NightSim.Netlist;
using NightSim.Reporting;

namespace NightSim.Tests.Reporting;

public sealed class ReportPartTests
{
    private static NetlistDefinition Load(string json)
    {
        NetlistLoadResult r = NetlistLoader.ReadText(json, "t.json");
        Assert.True(r.IsValid, string.Join("\n", r.Errors));
        return r.Definition!;
    }

    private const string Rc = """
        { "name": "rc", "parts": [
          { "id": "V1", "kind": "voltage-source", "nodes": ["in", "gnd"], "constant": "12V" },
          { "id": "R1", "kind": "resistor", "nodes": ["in", "out"], "value": "4k7" },
          { "id": "C1", "kind": "capacitor", "nodes": ["out", "gnd"], "value": "100n" } ] }
        """;

    [Fact]
    public void Hash_Ignores_Comments_Layout_And_Part_Order_But_Not_Values()
    {
        string reordered = """
            // the same circuit, written differently
            { "name": "rc again",
              "parts": [
                { "id": "C1", "kind": "capacitor", "nodes": ["out", "gnd"], "value": "0.1u" },
                { "id": "R1", "kind": "resistor", "nodes": ["in", "out"], "value": 4700 },
                { "id": "V1", "kind": "voltage-source", "nodes": ["in", "gnd"], "constant": 12 },
              ] }
            """;
        string a = ReportPart.Hash(Load(Rc));
        Assert.Matches("^[0-9a-f]{64}$", a);
        Assert.Equal(a, ReportPart.Hash(Load(reordered)));
        Assert.NotEqual(a, ReportPart.Hash(Load(Rc.Replace("4k7", "4k75", StringComparison.Ordinal))));
        Assert.NotEqual(a, ReportPart.Hash(Load(Rc.Replace("[\"in\", \"out\"]", "[\"out\", \"in\"]", StringComparison.Ordinal))));
    }

    [Fact]
    public void Listing_Shows_Connections_In_Pin_Order_And_Only_Values_That_Differ_From_Defaults()
    {
        IReadOnlyList<ReportPart> parts = ReportPart.List(Load(Rc));
        Assert.Equal(["V1", "R1", "C1"], parts.Select(p => p.Id));
        ReportPart r1 = parts[1];
        Assert.Equal("resistor", r1.Kind);
        Assert.Equal(["in", "out"], r1.Connections.Select(c => c.Value));
        Assert.Equal("4.7 kΩ", Assert.Single(r1.Values, v => v.Key == "value").Value);
        // The capacitor's unset parameters (initial voltage, leakage, …) keep their defaults and are not listed.
        Assert.Equal(["value"], parts[2].Values.Select(v => v.Key));
        Assert.Equal("100 nF", parts[2].Values[0].Value);
    }
}
