using System.Text.Json;
using Json.Schema;

namespace NightSim.Tests.Studies;

/// <summary>Checks a study file against its schema in docs/ with a general-purpose JSON Schema (draft 2020-12)
/// validator (JsonSchema.Net).</summary>
internal static class StudySchemas
{
    public static void AssertValid(string kind, byte[] json)
    {
        string path = Path.Combine(RepoPaths.Root, "docs", kind + ".schema.json");
        JsonSchema schema = JsonSchema.FromText(File.ReadAllText(path), new BuildOptions { SchemaRegistry = new SchemaRegistry() });
        using JsonDocument doc = JsonDocument.Parse(json);
        EvaluationResults r = schema.Evaluate(doc.RootElement, new EvaluationOptions { OutputFormat = OutputFormat.List });
        Assert.True(r.IsValid, string.Join("\n", (r.Details ?? []).Where(d => d.Errors is not null)
            .SelectMany(d => d.Errors!.Select(e => $"{d.InstanceLocation}: {e.Key} {e.Value}"))));
    }
}
