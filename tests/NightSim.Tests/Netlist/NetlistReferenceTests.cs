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
}
