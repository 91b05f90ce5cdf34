using System.Text.Json;
using NightSim.Sky;
using NightSim.Sky.Events;

namespace NightSim.Tests.Sky.Events;

public sealed class LightEventCatalogTests
{
    [Fact]
    public void Kinds_MatchTheSchemaEnum()
    {
        using JsonDocument schema = JsonDocument.Parse(File.ReadAllText(SkyTestFiles.RepoFile("netlists/scenario.schema.json")));
        string[] kinds = [.. schema.RootElement.GetProperty("$defs").GetProperty("event").GetProperty("properties")
            .GetProperty("kind").GetProperty("enum").EnumerateArray().Select(k => k.GetString()!).Order(StringComparer.Ordinal)];
        Assert.Equal(kinds, LightEventCatalog.Default.Kinds);
    }

    [Fact]
    public void DuplicateKind_Throws()
    {
        var c = new LightEventCatalog();
        c.Register("x", (_, _, _) => null);
        Assert.Throws<InvalidOperationException>(() => c.Register("x", (_, _, _) => null));
    }

    [Fact]
    public void StreamNames_ArePerKindAndOrdinal()
    {
        Assert.Equal("headlights#0", LightEventCatalog.StreamName("headlights", 0));
        Assert.Equal("headlights#1", LightEventCatalog.StreamName("headlights", 1));
    }
}
