using System.Globalization;
using System.Text;

namespace NightSim.Tests.Fixtures;

/// <summary>Netlists built in code for tests that need size or odd text rather than a demo circuit.</summary>
internal static class TestNetlists
{
    /// <summary>The key of a voltage source's constant value (one place, so a rename touches one line).</summary>
    public const string SourceConstantKey = "constant";

    /// <summary>A source, then an RC ladder (resistor in series, capacitor to ground) until <paramref name="parts"/>
    /// parts, ending in a resistor to ground; optionally written on one line.</summary>
    public static string Ladder(int parts, bool oneLine)
    {
        var inv = CultureInfo.InvariantCulture;
        string nl = oneLine ? "" : "\n";
        var sb = new StringBuilder();
        sb.Append("{ \"name\": \"ladder\", \"parts\": [").Append(nl);
        sb.Append(inv, $"{{ \"id\": \"V1\", \"kind\": \"voltage-source\", \"nodes\": [\"n0\", \"gnd\"], \"{SourceConstantKey}\": \"5\" }}");
        int count = 1, i = 0;
        while (count < parts - 1)
        {
            sb.Append(',').Append(nl).Append(inv, $"{{ \"id\": \"R{i}\", \"kind\": \"resistor\", \"nodes\": [\"n{i}\", \"n{i + 1}\"], \"value\": \"1k\" }}");
            count++;
            if (count < parts - 1)
            {
                sb.Append(',').Append(nl).Append(inv, $"{{ \"id\": \"C{i}\", \"kind\": \"capacitor\", \"nodes\": [\"n{i + 1}\", \"gnd\"], \"value\": \"1n\" }}");
                count++;
            }
            i++;
        }
        sb.Append(',').Append(nl).Append(inv, $"{{ \"id\": \"Rend\", \"kind\": \"resistor\", \"nodes\": [\"n{i}\", \"gnd\"], \"value\": \"1k\" }}");
        sb.Append(nl).Append("] }").Append(nl);
        return sb.ToString();
    }
}
