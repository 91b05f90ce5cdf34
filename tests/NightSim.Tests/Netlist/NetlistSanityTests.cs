using NightSim.Netlist;
using NightSim.Tests.Fixtures;

namespace NightSim.Tests.Netlist;

/// <summary>Netlists that parse but cannot mean what was written are refused or warned about.</summary>
public sealed class NetlistSanityTests
{
    private static NetlistLoadResult Load(params string[] parts) =>
        NetlistLoader.ReadText($"{{ \"name\": \"t\", \"parts\": [{string.Join(",\n", parts)}] }}", "t.json");

    private const string Source = "{ \"id\": \"V1\", \"kind\": \"voltage-source\", \"nodes\": [\"in\", \"gnd\"], \"" + TestNetlists.SourceConstantKey + "\": 5 }";
    private const string Load1 = "{ \"id\": \"R1\", \"kind\": \"resistor\", \"nodes\": [\"in\", \"gnd\"], \"value\": \"1k\" }";

    [Fact]
    public void A_Resistor_Between_0_And_Gnd_Is_No_Circuit()
    {
        NetlistLoadResult r = Load("{ \"id\": \"R1\", \"kind\": \"resistor\", \"nodes\": [\"0\", \"gnd\"], \"value\": \"1k\" }");
        Assert.False(r.IsValid);
        Assert.Contains(r.Errors, e => e.Message.Contains("no circuit to simulate", StringComparison.Ordinal));
    }

    [Fact]
    public void A_Shorted_Resistor_Warns_And_A_Shorted_Current_Source_Is_An_Error()
    {
        NetlistLoadResult r = Load(Source, Load1, "{ \"id\": \"R2\", \"kind\": \"resistor\", \"nodes\": [\"in\", \"in\"], \"value\": \"1k\" }");
        Assert.True(r.IsValid, string.Join("\n", r.Errors));
        NetlistError w = Assert.Single(r.Warnings, x => x.PartId == "R2");
        Assert.Contains("every pin of R2 is on node \"in\"", w.Message, StringComparison.Ordinal);

        r = Load(Source, Load1, "{ \"id\": \"I1\", \"kind\": \"current-source\", \"nodes\": [\"in\", \"in\"], \"" + TestNetlists.SourceConstantKey + "\": \"1m\" }");
        Assert.False(r.IsValid);
        NetlistError e = Assert.Single(r.Errors, x => x.PartId == "I1");
        Assert.Contains("pins p and n of I1 are both on node \"in\"", e.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Ids_With_Control_Characters_Or_Differing_Only_By_Spaces_Are_Errors()
    {
        NetlistLoadResult r = Load(Source, Load1, "{ \"id\": \"R\\u0000 2\", \"kind\": \"resistor\", \"nodes\": [\"in\", \"gnd\"], \"value\": \"1k\" }");
        Assert.Contains(r.Errors, e => e.Message.Contains("control character", StringComparison.Ordinal) && e.JsonPath == "$.parts[2].id");

        r = Load(Source, Load1, "{ \"id\": \"R 1\", \"kind\": \"resistor\", \"nodes\": [\"in\", \"gnd\"], \"value\": \"1k\" }");
        Assert.Contains(r.Errors, e => e.Message.Contains("differs from \"R1\" only by spaces", StringComparison.Ordinal));

        r = Load(Source, Load1, "{ \"id\": \"R2 \", \"kind\": \"resistor\", \"nodes\": [\"in\", \"gnd\"], \"value\": \"1k\" }");
        Assert.Contains(r.Errors, e => e.Message.Contains("starts or ends with a space", StringComparison.Ordinal));
    }

    [Fact]
    public void A_Number_Beyond_The_Double_Range_Is_An_Error_Not_Infinity()
    {
        // 1e999 exceeds the largest IEEE 754 binary64 value, ≈ 1.8e308 (IEEE 754-2019, §3.6 Table 3.5).
        NetlistLoadResult r = Load(Source, "{ \"id\": \"R1\", \"kind\": \"resistor\", \"nodes\": [\"in\", \"gnd\"], \"value\": 1e999 }");
        Assert.False(r.IsValid);
        NetlistError e = Assert.Single(r.Errors);
        Assert.Equal("$.parts[1].value", e.JsonPath);
        Assert.Contains("too large to be a number", e.Message, StringComparison.Ordinal);
    }
}
