using NightSim.Netlist;

namespace NightSim.Tests.Netlist;

public sealed class NearestNameTests
{
    // Levenshtein distance, worked examples from the original definition's usual illustration (from memory):
    // kitten → sitting = 3, flaw → lawn = 2.
    [Theory]
    [InlineData("kitten", "sitting", 3)]
    [InlineData("flaw", "lawn", 2)]
    [InlineData("", "abc", 3)]
    [InlineData("same", "same", 0)]
    public void Distance_Matches_Worked_Examples(string a, string b, int expected) => Assert.Equal(expected, NearestName.Distance(a, b));

    [Fact]
    public void Suggests_Only_Close_Names()
    {
        Assert.Equal("resistor", NearestName.Find("resitor", ["resistor", "capacitor"]));
        Assert.Equal("leakageCurrent", NearestName.Find("LeakageCurent", ["leakageResistance", "leakageCurrent"]));
        Assert.Null(NearestName.Find("transformer", ["resistor", "capacitor"]));
    }
}
