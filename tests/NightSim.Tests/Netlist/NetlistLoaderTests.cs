using NightSim.Devices;
using NightSim.Netlist;

namespace NightSim.Tests.Netlist;

public sealed class NetlistLoaderTests
{
    // One malformed file per loader error kind (tests/NightSim.Tests/data/netlists/bad-*.json). Each message must name
    // the file, line:column, the JSON path and the part. Expected positions are read off the files (1-based).
    [Theory]
    [InlineData("bad-syntax.json", 5, 5, "$", null, "invalid JSON")]
    [InlineData("bad-unknown-kind.json", 5, 27, "$.parts[1].kind", "R1", "unknown kind \"resitor\". hint: did you mean \"resistor\"?")]
    [InlineData("bad-missing-pin.json", 6, 48, "$.parts[2].nodes", "R2", "missing pins: a resistor has 2 pins (a, b) but \"nodes\" lists 1")]
    [InlineData("bad-extra-pin.json", 6, 90, "$.parts[2].pins.tap", "P1", "extra pin \"tap\"")]
    [InlineData("bad-unknown-parameter.json", 6, 80, "$.parts[2].leakageCurent", "C1", "did you mean \"leakageCurrent\"?")]
    [InlineData("bad-value.json", 5, 71, "$.parts[1].value", "R1", "\"meg\" is ambiguous. hint: use \"M\" for mega")]
    [InlineData("bad-unit.json", 6, 72, "$.parts[2].value", "C1", "unit \"H\" does not fit. hint: expected F")]
    [InlineData("bad-duplicate-id.json", 6, 13, "$.parts[2].id", "R1", "duplicate id \"R1\" (first used on line 5)")]
    [InlineData("bad-out-of-range.json", 5, 120, "$.parts[1].position", "P1", "\"position\" = 1.5 is outside its physical range 0 … 1")]
    [InlineData("bad-missing-parameter.json", 5, 5, "$.parts[1]", "R1", "missing required parameter \"value\" (Ω)")]
    [InlineData("bad-exclusive.json", 4, 86, "$.parts[0].points", "V1", "\"constant\" and \"points\" exclude each other")]
    [InlineData("bad-schedule-order.json", 5, 86, "$.parts[1].schedule[1][0]", "S1", "point 1 of \"schedule\" is at 1 h, not after 2 h")]
    [InlineData("bad-single-connection.json", 5, 56, "$.parts[1].nodes[1]", "R1", "node \"sense\" has a single connection. hint: did you mean \"sens\"?")]
    [InlineData("bad-no-ground.json", 3, 12, "$.parts", null, "no part connects to ground")]
    [InlineData("bad-source-loop.json", 5, 5, "$.parts[1]", "V2", "voltage sources form a loop: V2 closes a loop with V1")]
    [InlineData("bad-no-dc-path.json", 5, 56, "$.parts[1].nodes[1]", "C1", "node \"mid\" has no DC path to ground. hint: they connect only through capacitors")]
    public void Malformed_File_Gives_A_Precise_Message(string fileName, int line, int column, string path, string? partId, string fragment)
    {
        string file = RepoPaths.BadNetlist(fileName);
        var ex = Assert.Throws<NetlistException>(() => NetlistLoader.Load(file));
        NetlistError first = ex.Errors[0];
        string text = first.ToString();
        Assert.StartsWith($"{file}:{line}:{column}: error at {path}", text, StringComparison.Ordinal);
        Assert.Equal(path, first.JsonPath);
        Assert.Equal(partId, first.PartId);
        if (partId is not null) Assert.Contains($"(part {partId}): ", text, StringComparison.Ordinal);
        Assert.Contains(fragment, text, StringComparison.Ordinal);
    }

    [Fact]
    public void Every_Problem_Is_Reported_At_Once_In_File_Order()
    {
        NetlistLoadResult result = NetlistLoader.Read(RepoPaths.BadNetlist("bad-many.json"));
        Assert.False(result.IsValid);
        Assert.Null(result.Definition);
        Assert.Equal(["$.parts[1].value", "$.parts[2].esr", "$.parts[3].kind"], result.Errors.Select(e => e.JsonPath));
        Assert.Equal(["R1", "C1", "Q1"], result.Errors.Select(e => e.PartId));
    }

    [Fact]
    public void Missing_File_Is_An_Error_Not_An_Exception()
    {
        NetlistLoadResult result = NetlistLoader.Read("no/such/netlist.json");
        Assert.Equal("no/such/netlist.json: error at $: file not found. hint: check the path", Assert.Single(result.Errors).ToString());
    }

    [Fact]
    public void Valid_Netlist_Is_Typed_Si_With_Ground_Normalised_And_Defaults_Applied()
    {
        const string json = """
            {
              // comments and trailing commas are allowed
              "name": "t",
              "parts": [
                { "id": "V1", "kind": "voltage-source", "nodes": ["a", "GND"], "constant": "12V", },
                { "id": "R1", "kind": "resistor", "nodes": ["a", "b"], "value": "4k7" },
                { "id": "C1", "kind": "capacitor", "nodes": ["b", "Gnd"], "value": "3300uF", "leakageCurrent": "160u" },
                { "id": "S1", "kind": "switch", "nodes": ["a", "b"], "schedule": [["2h", 1], [7800, 0]] },
                { "id": "V2", "kind": "voltage-source", "nodes": ["c", "gnd"], "pulse": { "peak": 5, "start": "1m" } },
                { "id": "R2", "kind": "resistor", "nodes": ["c", "0"], "value": 1000 },
              ],
            }
            """;
        NetlistDefinition def = NetlistLoader.LoadText(json, "t.json");
        Assert.Equal("t", def.Name);
        Assert.Equal("t.json", def.SourceFile);
        Assert.Equal("gnd", def.Part("V1")!.Node("n"));
        Assert.Equal("gnd", def.Part("C1")!.Node("n"));
        Assert.Equal("gnd", def.Part("R2")!.Node("b"));                              // a bare "0" is taken as ground too
        Assert.Equal(4700, def.Part("R1")!.Parameters.Number("value"), 9);
        Assert.Equal(0.05, def.Part("R1")!.Parameters.Number("tolerance"), 12);      // default applied
        Assert.Equal(3.3e-3, def.Part("C1")!.Parameters.Number("value"), 12);
        Assert.Equal([(7200.0, 1.0), (7800.0, 0.0)], def.Part("S1")!.Parameters.Points("schedule"));
        PartParameters pulse = def.Part("V2")!.Parameters.Object("pulse")!;
        Assert.Equal(1e-3, pulse.Number("start"), 15);
        Assert.Equal(0, pulse.Number("base"));                                        // default inside a group
        Assert.False(def.Part("V1")!.Parameters.Has("pulse"));
        Assert.Equal(6, def.Part("R1")!.Location!.Line);
        Assert.Equal(5, def.Part("R1")!.Location!.Column);
    }

    [Fact]
    public void Every_Part_Builds_Its_Devices()
    {
        NetlistDefinition def = NetlistLoader.Load(Path.Combine(RepoPaths.Netlists, "divider.json"));
        List<Device> devices = def.Parts.SelectMany(p => PartCatalog.Find(p.Kind)!.Create(p)).ToList();
        Assert.Equal(["VCC", "R1", "R2", "P1", "C1"], devices.Select(d => d.Name));
        var pot = Assert.IsType<Potentiometer>(devices[3]);
        Assert.Equal(["mid", "set", "gnd"], pot.Nodes);
        Assert.Equal(5e3, pot.ResistanceA, 9);
    }

    [Fact]
    public void Missing_Waveform_And_Bad_Switch_Resistances_Are_Caught_By_Kind_Checks()
    {
        const string json = """
            { "name": "t", "parts": [
              { "id": "V1", "kind": "voltage-source", "nodes": ["a", "gnd"] },
              { "id": "S1", "kind": "switch", "nodes": ["a", "gnd"], "onResistance": "10", "offResistance": "1" },
            ] }
            """;
        NetlistLoadResult result = NetlistLoader.ReadText(json, "t.json");
        Assert.Equal(2, result.Errors.Count);
        Assert.Contains("no waveform given", result.Errors[0].Message, StringComparison.Ordinal);
        Assert.Contains("offResistance (1 Ω) must be larger than onResistance (10 Ω)", result.Errors[1].Message, StringComparison.Ordinal);
        Assert.NotNull(result.Errors[1].Hint);
    }

    [Fact]
    public void Pulse_Parameters_Are_Checked_Against_Each_Other()
    {
        const string json = """
            { "name": "t", "parts": [
              { "id": "V1", "kind": "voltage-source", "nodes": ["a", "gnd"], "pulse": { "peak": 5, "repeatEvery": "1m" } },
              { "id": "V2", "kind": "voltage-source", "nodes": ["b", "gnd"], "pulse": { "peak": 5, "hold": "2m", "repeatEvery": "1m" } },
              { "id": "R1", "kind": "resistor", "nodes": ["a", "gnd"], "value": "1k" },
              { "id": "R2", "kind": "resistor", "nodes": ["b", "gnd"], "value": "1k" },
            ] }
            """;
        NetlistLoadResult result = NetlistLoader.ReadText(json, "t.json");
        Assert.Equal(["V1", "V2"], result.Errors.Select(e => e.PartId));
        Assert.Contains("a repeating pulse needs \"hold\"", result.Errors[0].Message, StringComparison.Ordinal);
        Assert.Equal("pulse riseTime + hold + fallTime (2.002 ms) exceeds repeatEvery (1 ms)", result.Errors[1].Message);
        Assert.Equal("shorten \"hold\" or lengthen \"repeatEvery\"", result.Errors[1].Hint);
    }

    [Fact]
    public void A_Misspelt_Parameter_Gets_The_Nearest_Name_And_A_Retired_Short_Name_Its_Successor()
    {
        const string json = """
            { "name": "t", "parts": [
              { "id": "V1", "kind": "voltage-source", "nodes": ["vcc", "gnd"], "constant": 5 },
              { "id": "R1", "kind": "resistor", "nodes": ["vcc", "b"], "value": "100k" },
              { "id": "Q1", "kind": "npn", "pins": { "c": "vcc", "b": "b", "e": "e" }, "forwardGian": 200 },
              { "id": "Q2", "kind": "npn", "pins": { "c": "vcc", "b": "b", "e": "e" }, "bf": 200 },
              { "id": "D1", "kind": "diode", "nodes": ["e", "gnd"], "is": "2n" },
              { "id": "V2", "kind": "voltage-source", "nodes": ["p", "gnd"], "pulse": { "peak": 5, "width": "1m" } },
              { "id": "R2", "kind": "resistor", "nodes": ["p", "gnd"], "value": "1k" },
            ] }
            """;
        NetlistLoadResult result = NetlistLoader.ReadText(json, "t.json");
        Assert.Equal(["Q1", "Q2", "D1", "V2"], result.Errors.Select(e => e.PartId));
        Assert.StartsWith("unknown parameter \"forwardGian\"", result.Errors[0].Message, StringComparison.Ordinal);
        Assert.StartsWith("did you mean \"forwardGain\"?", result.Errors[0].Hint, StringComparison.Ordinal);
        Assert.StartsWith("unknown parameter \"bf\"", result.Errors[1].Message, StringComparison.Ordinal);
        Assert.StartsWith("this parameter is now called \"forwardGain\".", result.Errors[1].Hint, StringComparison.Ordinal);
        Assert.StartsWith("this parameter is now called \"saturationCurrent\".", result.Errors[2].Hint, StringComparison.Ordinal);
        Assert.StartsWith("this parameter is now called \"hold\".", result.Errors[3].Hint, StringComparison.Ordinal);
    }

    [Fact]
    public void Columns_Count_Characters_Not_Bytes()
    {
        // "µ" and "Ω" take two bytes each in UTF-8; the column must still point at the value.
        const string json = "{ \"name\": \"µΩ\", \"parts\": [ { \"id\": \"R1\", \"kind\": \"resistor\", \"nodes\": [\"a\", \"gnd\"], \"value\": \"1q\" } ] }";
        NetlistError e = NetlistLoader.ReadText(json, "t.json").Errors.Single(x => x.JsonPath == "$.parts[0].value");
        Assert.Equal(1, e.Line);
        Assert.Equal(json.IndexOf("\"1q\"", StringComparison.Ordinal) + 1, e.Column);
    }

    [Fact]
    public void Nodes_Differing_Only_In_Case_Give_A_Warning()
    {
        const string json = """
            { "name": "t", "parts": [
              { "id": "V1", "kind": "voltage-source", "nodes": ["vcc", "gnd"], "constant": 5 },
              { "id": "R1", "kind": "resistor", "nodes": ["vcc", "gnd"], "value": "1k" },
              { "id": "R2", "kind": "resistor", "nodes": ["Vcc", "gnd"], "value": "1k" },
              { "id": "R3", "kind": "resistor", "nodes": ["Vcc", "gnd"], "value": "1k" },
            ] }
            """;
        NetlistLoadResult result = NetlistLoader.ReadText(json, "t.json");
        Assert.True(result.IsValid);
        Assert.Contains("differ only in case", Assert.Single(result.Warnings).ToString(), StringComparison.Ordinal);
    }

    [Fact]
    public void Error_Text_Has_The_Documented_Shape()
    {
        var e = new NetlistError("a.json", 3, 7, "$.parts[2].value", "R3", "bad value", "write \"4k7\"");
        Assert.Equal("a.json:3:7: error at $.parts[2].value (part R3): bad value. hint: write \"4k7\"", e.ToString());
        Assert.Equal("a.json: warning at $ : x", (e with { Line = 0, JsonPath = "$ ", PartId = null, Message = "x", Hint = null, IsWarning = true }).ToString());
    }
}
