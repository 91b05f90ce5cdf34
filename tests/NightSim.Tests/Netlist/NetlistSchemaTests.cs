using System.Text.Json;
using Json.Schema;
using NightSim.Netlist;

namespace NightSim.Tests.Netlist;

public sealed class NetlistSchemaTests
{
    private static JsonSchema LoadSchema(string text) =>
        JsonSchema.FromText(text, new BuildOptions { SchemaRegistry = new SchemaRegistry() });

    private static JsonElement ReadInstance(string path)
    {
        using JsonDocument doc = JsonDocument.Parse(File.ReadAllText(path), new JsonDocumentOptions
        {
            CommentHandling = JsonCommentHandling.Skip,
            AllowTrailingCommas = true,
        });
        return doc.RootElement.Clone();
    }

    [Fact]
    public void Committed_Schema_Equals_The_Generated_One()
    {
        string committed = File.ReadAllText(Path.Combine(RepoPaths.Netlists, "netlist.schema.json"));
        Assert.True(committed == NetlistSchema.Generate(),
            "netlists/netlist.schema.json is out of date with the part catalogue. Regenerate it with: " +
            "dotnet run --project src/NightSim.Cli -c Release -- check --write-schema netlists/netlist.schema.json");
    }

    public static TheoryData<string> Examples() => [.. RepoPaths.ExampleNetlists.Select(f => Path.GetFileName(f))];

    [Theory]
    [MemberData(nameof(Examples))]
    public void Every_Example_Loads_And_Validates_Against_The_Schema(string fileName)
    {
        string path = Path.Combine(RepoPaths.Netlists, fileName);
        NetlistLoadResult loaded = NetlistLoader.Read(path);
        Assert.True(loaded.IsValid, string.Join(Environment.NewLine, loaded.Errors));
        Assert.Empty(loaded.Warnings);

        JsonElement instance = ReadInstance(path);
        Assert.Equal("./netlist.schema.json", instance.GetProperty("$schema").GetString());
        JsonSchema schema = LoadSchema(NetlistSchema.Generate());
        EvaluationResults results = schema.Evaluate(instance, new EvaluationOptions { OutputFormat = OutputFormat.List });
        Assert.True(results.IsValid, JsonSerializer.Serialize(results));
    }

    // Every form the engineering-value parser accepts must pass the schema's pattern, and plain words must not.
    [Theory]
    [InlineData("4k7", true)]
    [InlineData("0R47", true)]
    [InlineData("100nF", true)]
    [InlineData("-5mA", true)]
    [InlineData("1.5e-3", true)]
    [InlineData("2h", true)]
    [InlineData("5%", true)]
    [InlineData("90deg", true)]
    [InlineData("10 kΩ", true)]
    [InlineData("inf", true)]
    [InlineData("abc", false)]
    [InlineData("4,7k", false)]
    [InlineData("", false)]
    public void Engineering_Pattern_Matches_Parser_Forms(string text, bool matches) =>
        Assert.Equal(matches, System.Text.RegularExpressions.Regex.IsMatch(text, NetlistSchema.EngineeringPattern));

    [Fact]
    public void There_Are_Examples_To_Check() => Assert.True(RepoPaths.ExampleNetlists.Count() >= 2);

    [Theory]
    [InlineData("bad-unknown-kind.json")]
    [InlineData("bad-extra-pin.json")]
    [InlineData("bad-unknown-parameter.json")]
    [InlineData("bad-missing-pin.json")]
    [InlineData("bad-missing-parameter.json")]
    [InlineData("bad-exclusive.json")]
    public void Schema_Rejects_Structural_Mistakes(string fileName)
    {
        JsonSchema schema = LoadSchema(NetlistSchema.Generate());
        Assert.False(schema.Evaluate(ReadInstance(RepoPaths.BadNetlist(fileName))).IsValid);
    }
}
