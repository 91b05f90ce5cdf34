using System.Text;
using NightSim.Netlist;
using NightSim.Tests.Fixtures;
using NightSim.Text;

namespace NightSim.Tests.Text;

/// <summary>Line:column of byte offsets, and that a file all on one line costs linear work.</summary>
public sealed class Utf8PositionsTests
{
    /// <summary>Line and column by the definition (count characters from the last newline), for comparison.</summary>
    private static (int Line, int Column) Naive(byte[] text, int offset)
    {
        int line = 1, column = 1;
        for (int i = 0; i < offset; i++)
        {
            if (text[i] == (byte)'\n') { line++; column = 1; }
            else if ((text[i] & 0xC0) != 0x80) column++;
        }
        return (line, column);
    }

    [Fact]
    public void Positions_Agree_With_Counting_From_The_Start_In_Any_Order()
    {
        byte[] text = Encoding.UTF8.GetBytes("{ \"a\": \"µΩ\", \"b\": [1, 2],\n  \"c\": \"°C\" } // end\n\nx");
        var map = new Utf8Positions(text);
        // Forwards, then backwards and jumping between lines: each answer must equal the definition.
        var order = Enumerable.Range(0, text.Length + 1).Where(i => i == text.Length || (text[i] & 0xC0) != 0x80).ToList();
        foreach (int i in order.Concat(Enumerable.Reverse(order)).Concat(order.Where((_, k) => k % 3 == 0)))
            Assert.Equal(Naive(text, i), map.At(i));
    }

    [Fact]
    public void One_Line_Netlist_Of_20000_Parts_Costs_Linear_Work_And_Columns_Stay_Right()
    {
        string json = TestNetlists.Ladder(20000, oneLine: true);
        byte[] utf8 = Encoding.UTF8.GetBytes(json);
        Assert.DoesNotContain('\n', json.TrimEnd());
        var map = new Utf8Positions(utf8);
        int offset = 0, tokens = 0;
        while ((offset = json.IndexOf('"', offset + 1)) >= 0)
        {
            (int line, int column) = map.At(offset);
            Assert.Equal(1, line);
            Assert.Equal(offset + 1, column); // ASCII: column = byte offset + 1
            tokens++;
        }
        Assert.True(tokens > 100000);
        // Walking the tokens in order examines each byte once, not once per token (which would be ~tokens·length/2).
        Assert.True(map.BytesScanned <= utf8.Length, $"scanned {map.BytesScanned} bytes of a {utf8.Length}-byte line");
    }

    [Fact]
    public void A_Mistake_Late_On_A_Long_Line_Is_Located_By_Its_Column()
    {
        string json = TestNetlists.Ladder(2000, oneLine: true);
        int at = json.LastIndexOf("\"resistor\"", StringComparison.Ordinal);
        json = json[..at] + "\"resitor\"" + json[(at + "\"resistor\"".Length)..];
        NetlistLoadResult result = NetlistLoader.ReadText(json, "one-line.json");
        NetlistError error = Assert.Single(result.Errors, e => e.Message.Contains("unknown kind", StringComparison.Ordinal));
        Assert.Equal(1, error.Line);
        Assert.Equal(at + 1, error.Column);
        Assert.Equal("Rend", error.PartId);
    }
}
