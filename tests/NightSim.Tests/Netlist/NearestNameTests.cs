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

    [Fact]
    public void Long_Names_Get_No_Suggestion_And_Far_Lengths_Are_Not_Compared()
    {
        // A node name of a million characters beside another long one: comparing them would take 10^12 steps.
        string huge = new('x', 1_000_000);
        Assert.Null(NearestName.Find(huge, [huge[..999_999], "vcc"]));
        Assert.Null(NearestName.Find(new string('y', NearestName.MaxLength + 1), [new string('y', NearestName.MaxLength)]));
        // Within the limit the closest name still wins, whatever the length of the others.
        Assert.Equal("trig", NearestName.Find("trgi", [huge, "trig", "tr"]));
    }
}
