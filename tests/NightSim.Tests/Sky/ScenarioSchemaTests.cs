using System.Text.Json;
using Json.Schema;
using NightSim.Sky;

namespace NightSim.Tests.Sky;

/// <summary>netlists/scenario.schema.json (JSON Schema draft 2020-12) checked with a general-purpose validator (JsonSchema.Net).</summary>
public sealed class ScenarioSchemaTests
{
    private static JsonSchema Schema() => JsonSchema.FromText(
        File.ReadAllText(SkyTestFiles.RepoFile("netlists/scenario.schema.json")), new BuildOptions { SchemaRegistry = new SchemaRegistry() });

    private static JsonElement Read(string text)
    {
        using JsonDocument doc = JsonDocument.Parse(text, new JsonDocumentOptions { CommentHandling = JsonCommentHandling.Skip, AllowTrailingCommas = true });
        return doc.RootElement.Clone();
    }

    public static TheoryData<string> Examples() =>
        [.. Directory.GetFiles(SkyTestFiles.RepoFile("netlists/examples-sky"), "*.scenario.json").Select(f => Path.GetFileName(f)!).Order(StringComparer.Ordinal)];

    [Theory]
    [MemberData(nameof(Examples))]
    public void Example_ValidatesAndLoads(string fileName)
    {
        string path = Path.Combine(SkyTestFiles.RepoFile("netlists/examples-sky"), fileName);
        JsonElement instance = Read(File.ReadAllText(path));
        string schemaRef = instance.GetProperty("$schema").GetString()!;
        Assert.True(File.Exists(Path.Combine(Path.GetDirectoryName(path)!, schemaRef)), $"$schema {schemaRef} does not point at the schema");
        EvaluationResults r = Schema().Evaluate(instance, new EvaluationOptions { OutputFormat = OutputFormat.List });
        Assert.True(r.IsValid, JsonSerializer.Serialize(r));
        Assert.NotNull(ScenarioLoader.Load(path, out _));
    }

    [Theory]
    [InlineData("""{ "start": "2026-01-01" }""")]
    [InlineData("""{ "site": { "latitude": 52, "longitude": 8, "timeZone": "UTC" }, "start": "2026-01-01", "nigths": 2 }""")]
    [InlineData("""{ "site": { "latitude": 52, "longitude": 8, "timeZone": "UTC" }, "start": "2026-01-01", "events": [ { "kind": "fireworks" } ] }""")]
    [InlineData("""{ "site": { "latitude": 52, "longitude": 8, "timeZone": "UTC" }, "start": "2026-01-01", "events": [ { "kind": "headlights", "peakLux": 5 } ] }""")]
    [InlineData("""{ "site": { "latitude": 52, "longitude": 8, "timeZone": "UTC" }, "start": "2026-01-01", "events": [ { "kind": "steady-light", "on": "25:00", "off": "23:00", "lux": 1 } ] }""")]
    public void Schema_AndLoader_RejectStructuralMistakes(string json)
    {
        Assert.False(Schema().Evaluate(Read(json)).IsValid);
        Assert.Null(ScenarioLoader.Parse(json, "inline.json", null, out var errors));
        Assert.NotEmpty(errors);
    }
}
