using NightSim.Devices;
using NightSim.Netlist;

namespace NightSim.Tests.Netlist;

public sealed class NetlistReferenceTests
{
    [Fact]
    public void Committed_Part_Kind_Reference_Equals_The_Generated_One()
    {
        string committed = File.ReadAllText(Path.Combine(RepoPaths.Root, "docs", "part-kinds.md"));
        Assert.True(committed == NetlistReference.Markdown(),
            "docs/part-kinds.md is out of date with the part catalogue. Regenerate it with: " +
            "dotnet run --project src/NightSim.Cli -c Release -- check --write-schema netlists/netlist.schema.json --write-kinds docs/part-kinds.md");
    }

    [Fact]
    public void Reference_Lists_Every_Kind_And_Parameter()
    {
        string text = NetlistReference.Markdown();
        foreach (PartKind kind in PartCatalog.All)
        {
            Assert.Contains($"\n## {kind.Name}\n", text, StringComparison.Ordinal);
            foreach (ParameterSpec p in kind.Parameters) Assert.Contains($"`{p.Name}`", text, StringComparison.Ordinal);
        }
    }

    [Fact]
    public void The_Sine_Source_Carries_The_Mains_Caution()
    {
        // The voltage-source section: the sine row itself says a mains sine is not isolated, and the caution below the
        // table repeats the usual ones and defers to local codes and licensed electricians.
        string text = NetlistReference.Markdown();
        int start = text.IndexOf("\n## voltage-source\n", StringComparison.Ordinal);
        int end = text.IndexOf("\n## ", start + 1, StringComparison.Ordinal);
        string section = text[start..end];
        string sineRow = section.Split('\n').Single(l => l.StartsWith("| `sine` |", StringComparison.Ordinal));
        Assert.Contains("CAUTION", sineRow, StringComparison.Ordinal);
        Assert.Contains("non-isolated", sineRow, StringComparison.Ordinal);
        foreach (string word in (string[])["**Caution: mains.**", "NOT isolated", "lethal", "fuse", "X2-class", "bleeder", "enclosure", "local electrical codes", "licensed electrician"])
            Assert.Contains(word, section, StringComparison.Ordinal);
        // Beside the source, not in every kind: the current source has no such note.
        int cs = text.IndexOf("\n## current-source\n", StringComparison.Ordinal);
        Assert.DoesNotContain("**Caution: mains.**", text[cs..text.IndexOf("\n## ", cs + 1, StringComparison.Ordinal)], StringComparison.Ordinal);
    }
}
