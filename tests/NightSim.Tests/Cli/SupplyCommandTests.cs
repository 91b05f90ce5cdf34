using System.CommandLine;
using System.Text.Json;
using System.Text.Json.Nodes;
using Json.Schema;
using NightSim.Cli;
using NightSim.Tests.Supply;

namespace NightSim.Tests.Cli;

/// <summary>`nightsim supply`: files, schema, exit codes and messages (the numbers themselves are checked in
/// Supply/SupplyBudgetTests against hand values).</summary>
public sealed class SupplyCommandTests
{
    private static (int Exit, string Out, string Err) Run(params string[] args) => CliRun.Invoke(args);

    private static string TempDir() => Path.Combine(Path.GetTempPath(), "nightsim-supply-" + Guid.NewGuid().ToString("N"));

    private static JsonSchema Schema() => JsonSchema.FromText(File.ReadAllText(Path.Combine(RepoPaths.Root, "docs", "supply.schema.json")),
        new BuildOptions { SchemaRegistry = new SchemaRegistry() });

    private static string Describe(EvaluationResults r) =>
        string.Join("\n", (r.Details ?? []).Where(d => d.Errors is not null).SelectMany(d => d.Errors!.Select(e => $"{d.InstanceLocation}: {e.Key} {e.Value}")));

    [Fact]
    public void Writes_A_Budget_That_Validates_And_A_Pull_In_Plot()
    {
        string dir = TempDir();
        try
        {
            (int exit, string output, string error) = Run("supply", SupplyBudgets.Netlist("garden-path-dropper"), "--mains", "230V", "--hz", "50", "--out", dir);
            Assert.True(exit == 0, error);
            Assert.Contains("standby-day", output, StringComparison.Ordinal);
            Assert.Contains("relay-on", output, StringComparison.Ordinal);
            Assert.Contains("bleeder:", output, StringComparison.Ordinal);
            Assert.Contains("CAUTION: This design connects to mains. It is NOT isolated", output, StringComparison.Ordinal);
            Assert.Contains("licensed electrician", output, StringComparison.Ordinal);
            Assert.True(File.Exists(Path.Combine(dir, "rail-pull-in.svg")));
            byte[] json = File.ReadAllBytes(Path.Combine(dir, "supply.json"));
            EvaluationResults r = Schema().Evaluate(JsonDocument.Parse(json).RootElement, new EvaluationOptions { OutputFormat = OutputFormat.List });
            Assert.True(r.IsValid, Describe(r));
            JsonNode doc = JsonNode.Parse(json)!;
            Assert.True(doc["mains"]!["overridden"]!.GetValue<bool>());
            Assert.Equal(230.0, doc["mains"]!["rms"]!.GetValue<double>(), 1e-6);
            Assert.Contains("rail-pull-in.svg", doc["plots"]!.AsArray().Select(p => p!.GetValue<string>()));
            Assert.Equal(3, doc["states"]!.AsArray().Count);
            Assert.Equal(4, doc["cautions"]!.AsArray().Count);
            Assert.False(Directory.EnumerateFiles(dir, "*.tmp").Any());
        }
        finally
        {
            if (Directory.Exists(dir)) Directory.Delete(dir, recursive: true);
        }
    }

    [Fact]
    public void Json_On_The_Terminal_Is_The_File_And_The_Schema_Can_Fail()
    {
        string dir = TempDir();
        try
        {
            (int exit, string output, string error) = Run("supply", SupplyBudgets.Netlist("bridge-zener-load"), "--format", "json", "--out", dir);
            Assert.True(exit == 0, error);
            JsonNode doc = JsonNode.Parse(output)!;
            EvaluationResults ok = Schema().Evaluate(JsonDocument.Parse(output).RootElement);
            Assert.True(ok.IsValid);
            Assert.Equal("DZ", doc["section"]!["railZener"]!.GetValue<string>());
            // Every key is documented: the schema refuses an unknown one and a missing one.
            JsonNode extra = JsonNode.Parse(output)!;
            extra["states"]![0]!["surprise"] = 1;
            Assert.False(Schema().Evaluate(JsonDocument.Parse(extra.ToJsonString()).RootElement).IsValid);
            JsonNode missing = JsonNode.Parse(output)!;
            missing["bleeder"]!.AsObject().Remove("secondsToSafe");
            Assert.False(Schema().Evaluate(JsonDocument.Parse(missing.ToJsonString()).RootElement).IsValid);
        }
        finally
        {
            if (Directory.Exists(dir)) Directory.Delete(dir, recursive: true);
        }
    }

    [Fact]
    public void No_Mains_Source_Says_So_And_Exits_0()
    {
        string dir = TempDir();
        (int exit, string output, _) = Run("supply", Path.Combine(RepoPaths.Netlists, "garden-path.json"), "--out", dir);
        Assert.Equal(0, exit);
        Assert.Contains("no mains-fed supply found", output, StringComparison.Ordinal);
        Assert.False(Directory.Exists(dir));
        (exit, output, _) = Run("supply", Path.Combine(RepoPaths.Netlists, "garden-path.json"), "--format", "json", "--out", dir);
        Assert.Equal(0, exit);
        EvaluationResults r = Schema().Evaluate(JsonDocument.Parse(output).RootElement, new EvaluationOptions { OutputFormat = OutputFormat.List });
        Assert.True(r.IsValid, Describe(r));
        Assert.False(JsonNode.Parse(output)!["supplyFound"]!.GetValue<bool>());
    }

    [Fact]
    public void Bad_Input_Is_Exit_2_Naming_The_File_And_Part()
    {
        string bad = Path.Combine(Path.GetTempPath(), "nightsim-supply-bad-" + Guid.NewGuid().ToString("N") + ".json");
        File.WriteAllText(bad, """{ "name": "bad", "parts": [ { "id": "RBL", "kind": "resistor", "nodes": ["a", "gnd"], "value": "1M", "powerRating": "-1W" } ] }""");
        try
        {
            (int exit, _, string error) = Run("supply", bad);
            Assert.Equal(2, exit);
            Assert.Contains(Path.GetFileName(bad), error, StringComparison.Ordinal);
            Assert.Contains("RBL", error, StringComparison.Ordinal);
            Assert.Contains("powerRating", error, StringComparison.Ordinal);
            Assert.DoesNotContain("   at ", error, StringComparison.Ordinal);
        }
        finally
        {
            File.Delete(bad);
        }
        (int missing, _, string err2) = Run("supply", "no-such-netlist.json");
        Assert.Equal(2, missing);
        Assert.Contains("no-such-netlist.json", err2, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("--mains", "230,5V")]
    [InlineData("--mains", "lots")]
    [InlineData("--mains", "0V")]
    [InlineData("--hz", "0")]
    public void A_Bad_Mains_Option_Is_A_Command_Line_Mistake(string option, string value)
    {
        (int exit, _, string error) = Run("supply", SupplyBudgets.Netlist("bridge-zener-load"), option, value);
        Assert.Equal(1, exit);
        Assert.Contains(option, error, StringComparison.Ordinal);
    }
}
