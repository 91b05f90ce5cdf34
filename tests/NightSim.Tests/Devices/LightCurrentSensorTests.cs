using System.CommandLine;
using NightSim.Analysis;
using NightSim.Cli;
using NightSim.Devices;
using NightSim.Devices.Light;
using NightSim.Netlist;
using NightSim.Runs;
using NightSim.Sky;

namespace NightSim.Tests.Devices;

public sealed class LightCurrentSensorTests
{
    private static LightCurrentSensor Make(double lux) =>
        new("S1", "S1", "vcc", "out", 0.5e-6, 10e-9, 0.3, new LightInput("sensor", 1.0, lux, null));

    // Full headroom: I = currentPerLux·E + dark current = 0.5 µA/lx × 100 lx + 10 nA = 50.01 µA, times
    // tanh(12 V / 0.3 V) = 1 − 4e-35; it enters at the supply pin and leaves at the output pin (by hand).
    [Fact]
    public void Current_Is_Proportional_To_Lux_With_Headroom()
    {
        var h = new StampHarness("vcc", "out");
        LightCurrentSensor s = Make(100.0);
        s.Setup(h);
        LoadContext ctx = h.Load(s, [12.0, 0.0]);
        Assert.Equal(50.01e-6, ctx.J[0], 1e-15);
        Assert.Equal(-50.01e-6, ctx.J[1], 1e-15);
        h.AssertJacobians(s, [12.0, 0.0]);
    }

    // Short of headroom: 0.15 V across the sensor gives tanh(0.5) = 0.462117 of the full current (by hand), and the
    // slope there is I·(1 − tanh²)/V_h, checked against finite differences.
    [Fact]
    public void Current_Falls_Off_Near_The_Supply()
    {
        var h = new StampHarness("vcc", "out");
        LightCurrentSensor s = Make(100.0);
        s.Setup(h);
        LoadContext ctx = h.Load(s, [12.0, 11.85]);
        Assert.Equal(50.01e-6 * Math.Tanh(0.5), ctx.J[0], 1e-15);
        h.AssertJacobians(s, [12.0, 11.85]);
        h.AssertJacobians(s, [12.0, 12.1]);
    }

    // A dusk switch with this sensor: its current into 470 kΩ against a comparator whose reference is
    // 12 V · 10k / 110k = 1.0909 V with a 0.1 V hysteresis band centred on it, so the comparator switches when the
    // sensor node falls below 1.0409 V, i.e. at I = 1.0409 V / 470 kΩ = 2.2147 µA (Ohm's law, the divider), i.e.
    // E = (I − 10 nA) / 0.5 µA/lx = 4.409 lx (by hand).
    private const string Design = """
        {
          "name": "current-sensor-dusk",
          "parts": [
            { "id": "V1", "kind": "voltage-source", "nodes": ["vcc", "gnd"], "constant": "12V" },
            { "id": "S1", "kind": "light-current-sensor", "nodes": ["vcc", "sense"], "currentPerLux": "0.5u", "darkCurrent": "10n", "headroom": "0.3V", "channel": "CHANNEL" },
            { "id": "RL", "kind": "resistor", "nodes": ["sense", "gnd"], "value": "470k" },
            { "id": "R2", "kind": "resistor", "nodes": ["vcc", "ref"], "value": "100k" },
            { "id": "R3", "kind": "resistor", "nodes": ["ref", "gnd"], "value": "10k" },
            { "id": "U2", "kind": "comparator", "pins": { "plus": "ref", "minus": "sense", "output": "dark", "vcc": "vcc", "gnd": "gnd" }, "hysteresis": "0.1V" },
            { "id": "RB1", "kind": "resistor", "nodes": ["dark", "b1"], "value": "47k" },
            { "id": "Q1", "kind": "npn", "pins": { "c": "col", "b": "b1", "e": "gnd" } },
            { "id": "RC1", "kind": "resistor", "nodes": ["vcc", "col"], "value": "10k" },
            { "id": "CT", "kind": "capacitor", "nodes": ["col", "trig"], "value": "10n" },
            { "id": "RT", "kind": "resistor", "nodes": ["vcc", "trig"], "value": "100k" },
            { "id": "U1", "kind": "timer-555", "pins": { "vcc": "vcc", "gnd": "gnd", "trigger": "trig", "threshold": "tc", "discharge": "tc", "output": "out", "reset": "rst" }, "variant": "cmos" },
            { "id": "RR", "kind": "resistor", "nodes": ["vcc", "rst"], "value": "100k" },
            { "id": "CR", "kind": "capacitor", "nodes": ["rst", "gnd"], "value": "10u" },
            { "id": "RTIM", "kind": "resistor", "nodes": ["vcc", "tc"], "value": "1M" },
            { "id": "CTIM", "kind": "capacitor", "nodes": ["tc", "gnd"], "value": "1000u" },
            { "id": "RB2", "kind": "resistor", "nodes": ["out", "b2"], "value": "4k7" },
            { "id": "Q2", "kind": "npn", "pins": { "c": "coil", "b": "b2", "e": "gnd" } },
            { "id": "K1", "kind": "relay", "pins": { "coilA": "vcc", "coilB": "coil" }, "pullIn": "9V", "dropOut": "1.2V", "coilResistance": "400" },
            { "id": "D2", "kind": "diode", "nodes": ["coil", "vcc"] }
          ]
        }
        """;

    private const string Night = """
        {
          "name": "clear-november-night",
          "site": { "name": "Invented Garden", "latitude": 52.1, "longitude": 8.6, "timeZone": "Europe/Berlin", "elevation": 80 },
          "start": "2026-11-20",
          "nights": 1,
          "seed": 3,
          "sensor": { "exposure": 0.5 },
          "weather": { "sky": "clear", "floorLux": 0.02 },
          "events": []
        }
        """;

    private const double Level = (12.0 * 10.0 / 110.0 - 0.05) / 470e3 / 0.5e-6 - 10e-9 / 0.5e-6;

    [Fact]
    public void A_Night_Run_Finds_Its_Switching_Level_And_Switch_On()
    {
        NightRunResult r = NightRun.Run(new NightRunRequest
        {
            Netlist = NetlistLoader.LoadText(Design.Replace("CHANNEL", "sensor", StringComparison.Ordinal), "current-sensor-dusk.json"),
            NetlistPath = "current-sensor-dusk.json",
            Scenario = ScenarioLoader.Parse(Night, "night.scenario.json", null, out _) ?? throw new InvalidOperationException("scenario"),
            ScenarioPath = "night.scenario.json",
        });
        Assert.Equal(4.409, Level, 3);
        Assert.NotNull(r.Facts.Sensor);
        Assert.Equal("S1", r.Facts.Sensor!.PartId);
        Assert.Equal(Level, r.Facts.Sensor.SwitchingLux!.Value, 0.01 * Level);
        // The sensor has no lag, so the light at the dusk switch-on is the switching level (the sky falls about 1 % a
        // minute at dusk; the trigger network adds milliseconds).
        Finding dusk = Assert.Single(r.Analysis.Findings, f => f.Code == "dusk-switch-on");
        double atOn = double.Parse(System.Text.RegularExpressions.Regex.Match(dusk.Message, @"at ([0-9.]+) lx").Groups[1].Value, System.Globalization.CultureInfo.InvariantCulture);
        Assert.Equal(Level, atOn, 0.02 * Level);
        Assert.True(r.Analysis.Nights[0].LoadOn.Count >= 1);
    }

    // A channel the scenario does not define is refused before the run, as for the photoresistor: exit code 2 and a
    // message naming the file, the part and the channel, nothing written.
    [Fact]
    public void An_Unknown_Channel_Is_Refused_At_Setup()
    {
        string dir = Path.Combine(Path.GetTempPath(), "nightsim-lcs-" + Guid.NewGuid().ToString("N"));
        Directory.CreateDirectory(dir);
        try
        {
            string netlist = Path.Combine(dir, "current-sensor-dusk.json");
            File.WriteAllText(netlist, Design.Replace("CHANNEL", "porch", StringComparison.Ordinal));
            File.WriteAllText(Path.Combine(dir, "current-sensor-dusk.scenario.json"), Night);
            string outDir = Path.Combine(dir, "out");
            var output = new StringWriter();
            var error = new StringWriter();
            int exit = Program.CreateRoot().Parse(["simulate", netlist, "--out", outDir, "--no-plots", "--no-progress"])
                .Invoke(new InvocationConfiguration { Output = output, Error = error });
            Assert.Equal(2, exit);
            Assert.Contains("current-sensor-dusk.json:", error.ToString(), StringComparison.Ordinal);
            Assert.Contains("(part S1): reads light channel 'porch', which scenario", error.ToString(), StringComparison.Ordinal);
            Assert.Contains("hint: channels: sensor", error.ToString(), StringComparison.Ordinal);
            Assert.DoesNotContain("   at ", error.ToString(), StringComparison.Ordinal);
            Assert.False(Directory.Exists(outDir) && Directory.EnumerateFiles(outDir).Any());
        }
        finally
        {
            Directory.Delete(dir, recursive: true);
        }
    }
}
