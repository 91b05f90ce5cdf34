using System.Text.Json;
using System.Text.Json.Nodes;
using Json.Schema;
using NightSim.Reporting;

namespace NightSim.Tests.Reporting;

/// <summary>
/// report.json against docs/report.schema.json, checked by a general-purpose JSON Schema (draft 2020-12) validator
/// (JsonSchema.Net), on invented demo data.
/// </summary>
public sealed class JsonReportSchemaTests
{
    private static JsonSchema LoadSchema()
    {
        string path = Path.Combine(RepoPaths.Root, "docs", "report.schema.json");
        // A private registry per load: the schema's $id may be built more than once in one test run.
        return JsonSchema.FromText(File.ReadAllText(path), new BuildOptions { SchemaRegistry = new SchemaRegistry() });
    }

    private static JsonElement Written(NightReport report)
    {
        using var ms = new MemoryStream();
        JsonReportWriter.Write(report, ms);
        return JsonDocument.Parse(ms.ToArray()).RootElement.Clone();
    }

    [Fact]
    public void DemoReportValidatesAgainstSchema()
    {
        EvaluationResults result = LoadSchema().Evaluate(Written(DemoReportData.Report()), new EvaluationOptions { OutputFormat = OutputFormat.List });
        Assert.True(result.IsValid, Describe(result));
    }

    [Fact]
    public void EmptyRunValidatesAgainstSchema()
    {
        var report = new NightReport
        {
            Tool = "nightsim 0.1.0", Netlist = "n.json", CircuitName = "empty (invented)",
            Statistics = new ReportStatistics(0, 0, 0, 0, 0),
        };
        EvaluationResults result = LoadSchema().Evaluate(Written(report), new EvaluationOptions { OutputFormat = OutputFormat.List });
        Assert.True(result.IsValid, Describe(result));
    }

    [Fact]
    public void SchemaRejectsBrokenReport()
    {
        // The validator must be able to fail: drop a required key and break a time string.
        JsonNode node = JsonNode.Parse(Written(DemoReportData.Report()).GetRawText())!;
        node.AsObject().Remove("statistics");
        node["nights"]![0]!["sunset"] = "17:42";
        JsonElement broken = JsonDocument.Parse(node.ToJsonString()).RootElement;
        Assert.False(LoadSchema().Evaluate(broken).IsValid);
    }

    private static string Describe(EvaluationResults r) =>
        string.Join("\n", (r.Details ?? []).Where(d => d.Errors is not null)
            .SelectMany(d => d.Errors!.Select(e => $"{d.InstanceLocation}: {e.Key} {e.Value}")));
}
