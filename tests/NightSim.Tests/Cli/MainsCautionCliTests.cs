using System.CommandLine;
using System.Text.Json;
using System.Xml.Linq;
using NightSim.Cli;

namespace NightSim.Tests.Cli;

/// <summary>
/// The mains cautions where a builder sees them: `check`, `simulate` (terminal), report.json and report.html. A source
/// of 50 V or more (the top of extra-low voltage, 50 V AC: IEC 60449 band I, from memory), whatever its waveform, gives
/// the not-isolated cautions; a low-voltage design whose relay switches a mains lamp gets the contact and wiring
/// cautions instead; a low-voltage lamp gets none. Invented circuits: a rail into a resistor, a relay on 12 V.
/// </summary>
public sealed class MainsCautionCliTests : IDisposable
{
    private readonly string _dir = Path.Combine(Path.GetTempPath(), "nightsim-caution-" + Guid.NewGuid().ToString("N"));

    public MainsCautionCliTests() => Directory.CreateDirectory(_dir);

    public void Dispose()
    {
        if (Directory.Exists(_dir)) Directory.Delete(_dir, recursive: true);
    }

    private static (int Exit, string Out, string Err) Run(params string[] args) => CliRun.Invoke(args);

    private const string Scenario = """
        { "name": "one-night", "site": { "name": "Invented Field 3", "latitude": 50.1, "longitude": 8.7, "timeZone": "Europe/Berlin" },
          "start": "2026-11-20", "nights": 1, "seed": 5 }
        """;

    /// <summary>Writes a netlist (a source into a resistor, plus <paramref name="more"/> parts) and its scenario.</summary>
    private string Netlist(string name, string source, string more = "")
    {
        string path = Path.Combine(_dir, name + ".json");
        File.WriteAllText(path, $$"""
            { "name": "{{name}}", "parts": [
              { "id": "V1", "kind": "voltage-source", "nodes": ["rail", "gnd"], {{source}} },
              { "id": "R1", "kind": "resistor", "nodes": ["rail", "gnd"], "value": "47k" } {{more}}
            ] }
            """);
        File.WriteAllText(Path.Combine(_dir, name + ".scenario.json"), Scenario);
        return path;
    }

    private const string MainsLampRelay = """
        , { "id": "V2", "kind": "voltage-source", "nodes": ["low", "gnd"], "constant": "12V" },
          { "id": "K1", "kind": "relay", "pins": { "coilA": "low", "coilB": "gnd" }, "load": "lamp", "loadPower": "40W" }
        """;

    private static void AssertNotIsolated(string text) =>
        Assert.Contains("This design connects to mains. It is NOT isolated", text, StringComparison.Ordinal);

    private static void AssertDefersToElectricians(string text)
    {
        Assert.Contains("local electrical codes", text, StringComparison.Ordinal);
        Assert.Contains("licensed electrician", text, StringComparison.Ordinal);
    }

    /// <summary>The caution texts of a night run's report.json and report.html.</summary>
    private (string Terminal, List<string> Json, List<string> Html) Simulate(string netlist)
    {
        string outDir = Path.Combine(_dir, Path.GetFileNameWithoutExtension(netlist) + "-out");
        (int exit, string output, string error) = Run("simulate", netlist, "--out", outDir, "--no-plots");
        Assert.True(exit == 0, error + output);
        using JsonDocument json = JsonDocument.Parse(File.ReadAllText(Path.Combine(outDir, "report.json")));
        List<string> fromJson = [.. json.RootElement.GetProperty("cautions").EnumerateArray().Select(c => c.GetString()!)];
        XElement? section = XDocument.Parse(File.ReadAllText(Path.Combine(outDir, "report.html"))).Descendants()
            .FirstOrDefault(e => e.Name.LocalName == "section" && (string?)e.Attribute("id") == "cautions");
        List<string> fromHtml = section is null ? [] : [.. section.Descendants().Where(e => e.Name.LocalName == "li").Select(e => e.Value)];
        return (output, fromJson, fromHtml);
    }

    [Theory]
    [InlineData("sine", "\"sine\": { \"amplitude\": \"325V\", \"frequency\": \"50Hz\" }")]
    [InlineData("constant", "\"constant\": \"60V\"")]
    [InlineData("points", "\"points\": [[0, 0], [\"2h\", \"120V\"], [\"4h\", 0]]")]
    public void Check_Prints_The_Not_Isolated_Cautions_For_A_Source_Of_50_V_Or_More(string name, string source)
    {
        (int exit, string output, string error) = Run("check", Netlist(name, source));
        Assert.True(exit == 0, error);
        AssertNotIsolated(output);
        AssertDefersToElectricians(output);
    }

    [Fact]
    public void Simulate_Of_A_Mains_Sine_Prints_The_Not_Isolated_Cautions()
    {
        // A plain transient of two mains cycles (a whole night at full mains detail is the supply work's).
        (int exit, string output, string error) = Run("simulate", Netlist("sine-for", "\"sine\": { \"amplitude\": \"325V\", \"frequency\": \"50Hz\" }"),
            "--for", "40ms", "--out", Path.Combine(_dir, "sine-for-out"));
        Assert.True(exit == 0, error);
        AssertNotIsolated(output);
        AssertDefersToElectricians(output);
    }

    [Theory]
    [InlineData("slow-sine", "\"sine\": { \"amplitude\": \"325V\", \"frequency\": \"1m\" }")] // a slow sine keeps the night run short; the caution reads the amplitude
    [InlineData("night-constant", "\"constant\": \"60V\"")]
    [InlineData("night-points", "\"points\": [[0, 0], [\"2h\", \"120V\"], [\"4h\", 0]]")]
    public void A_Night_Run_Puts_The_Not_Isolated_Cautions_In_The_Terminal_The_Json_And_The_Page(string name, string source)
    {
        (string terminal, List<string> json, List<string> html) = Simulate(Netlist(name, source));
        AssertNotIsolated(terminal);
        AssertNotIsolated(string.Join(" ", json));
        AssertDefersToElectricians(string.Join(" ", json));
        Assert.Equal(json, html);
    }

    [Fact]
    public void A_Low_Voltage_Design_Switching_A_Mains_Lamp_Gets_The_Contact_Cautions_Everywhere()
    {
        string netlist = Netlist("mains-lamp", "\"constant\": \"12V\"", MainsLampRelay);
        (int exit, string checkOut, string error) = Run("check", netlist);
        Assert.True(exit == 0, error);
        (string terminal, List<string> json, List<string> html) = Simulate(netlist);
        foreach (string text in (string[])[checkOut, terminal, string.Join(" ", json), string.Join(" ", html)])
        {
            Assert.DoesNotContain("NOT isolated", text, StringComparison.Ordinal);
            Assert.Contains("relay contacts, their terminals and the lamp wiring carry a lethal voltage", text, StringComparison.Ordinal);
            AssertDefersToElectricians(text);
        }
    }

    [Fact]
    public void A_Low_Voltage_Lamp_Gets_No_Caution()
    {
        string netlist = Netlist("low-lamp", "\"constant\": \"12V\"", MainsLampRelay.Replace("\"loadPower\": \"40W\"", "\"loadPower\": \"20W\", \"loadVoltage\": \"12V\"", StringComparison.Ordinal));
        (int exit, string checkOut, string error) = Run("check", netlist);
        Assert.True(exit == 0, error);
        Assert.DoesNotContain("CAUTION", checkOut, StringComparison.Ordinal);
        (string terminal, List<string> json, List<string> html) = Simulate(netlist);
        Assert.DoesNotContain("CAUTION", terminal, StringComparison.Ordinal);
        Assert.Empty(json);
        Assert.Empty(html);
    }
}
