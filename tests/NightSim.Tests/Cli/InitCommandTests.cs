using System.CommandLine;
using System.Text.Json;
using NightSim.Cli;

namespace NightSim.Tests.Cli;

public sealed class InitCommandTests
{
    private static (int Exit, string Out, string Err) Run(params string[] args) => CliRun.Invoke(args);

    private static string TempDir() => Path.Combine(Path.GetTempPath(), "nightsim-init-" + Guid.NewGuid().ToString("N"));

    /// <summary>Writes the template, checks it, runs its night and returns the night of report.json.</summary>
    private static JsonElement InitCheckSimulate(string dir, string template, params string[] extra)
    {
        (int exit, string output, string error) = Run(["init", "--template", template, .. extra, dir]);
        Assert.True(exit == 0, error);
        string netlist = Path.Combine(dir, template + ".json");
        string scenario = Path.Combine(dir, template + ".scenario.json");
        Assert.Contains($"nightsim check {netlist} {scenario}", output, StringComparison.Ordinal);
        Assert.True(File.Exists(Path.Combine(dir, "netlist.schema.json")));
        Assert.True(File.Exists(Path.Combine(dir, "scenario.schema.json")));

        (exit, string checkOut, error) = Run("check", netlist, scenario);
        Assert.True(exit == 0, error);
        Assert.Contains("warnings: none", checkOut, StringComparison.Ordinal);

        string outDir = Path.Combine(dir, "out");
        (exit, _, error) = Run("simulate", netlist, "--out", outDir, "--no-plots", "--no-progress", "--format", "json");
        Assert.True(exit == 0, error);
        using JsonDocument doc = JsonDocument.Parse(File.ReadAllText(Path.Combine(outDir, "report.json")));
        return doc.RootElement.GetProperty("nights")[0].Clone();
    }

    /// <summary>One switch-on a night, caused by dusk, between sunset and the end of nautical twilight (a dusk switch
    /// set to a few lux switches in civil twilight; common practice), no false trigger, not missed.</summary>
    private static (DateTimeOffset On, DateTimeOffset? Off) AssertOneDuskSwitchOn(JsonElement night)
    {
        JsonElement loadOn = night.GetProperty("loadOn");
        Assert.Equal(1, loadOn.GetArrayLength());
        JsonElement on = loadOn[0];
        Assert.Equal("dusk", on.GetProperty("cause").GetString());
        Assert.True(on.GetProperty("expected").GetBoolean());
        Assert.Equal(0, night.GetProperty("falseTriggers").GetInt32());
        Assert.False(night.GetProperty("missed").GetBoolean());
        DateTimeOffset start = on.GetProperty("start").GetDateTimeOffset();
        DateTimeOffset sunset = night.GetProperty("sunset").GetDateTimeOffset();
        DateTimeOffset civilDusk = night.GetProperty("civilDusk").GetDateTimeOffset();
        Assert.InRange(start, sunset, civilDusk.AddMinutes(40)); // nautical dusk is 35–50 min after civil dusk at 40–52° in November
        return (start, on.GetProperty("end").ValueKind == JsonValueKind.Null ? null : on.GetProperty("end").GetDateTimeOffset());
    }

    [Theory]
    [InlineData("one-shot")]
    [InlineData("one-shot-latched")]
    public void One_Shot_Templates_Switch_On_At_Dusk_For_The_Timer_Closed_Form(string template)
    {
        string dir = TempDir();
        try
        {
            JsonElement night = InitCheckSimulate(dir, template);
            (DateTimeOffset on, DateTimeOffset? off) = AssertOneDuskSwitchOn(night);
            Assert.NotNull(off);
            // The template's timing: RTIM 3.3 MΩ, CTIM 3300 µF with 0.3 µA leakage, 12 V. The capacitor charges from
            // 0 towards V∞ = V − I_leak·R (Thevenin of the source, resistor and leakage sink) and the timer ends at
            // 2/3·V: t = R·C·ln(V∞ / (V∞ − 2V/3)) (RC charging law; the 2/3 threshold of the 555 one-shot, as in
            // the 1.1·R·C = R·C·ln 3 rule of the 555's published monostable timing).
            double r = 3.3e6, c = 3300e-6, v = 12, leak = 0.3e-6;
            double vInf = v - leak * r;
            double expected = r * c * Math.Log(vInf / (vInf - 2 * v / 3));
            double seconds = (off!.Value - on).TotalSeconds;
            Assert.InRange(seconds, expected * 0.99, expected * 1.01);
        }
        finally
        {
            if (Directory.Exists(dir)) Directory.Delete(dir, recursive: true);
        }
    }

    [Theory]
    [InlineData("ldr-comparator")]
    [InlineData("phototransistor")]
    public void Dusk_To_Dawn_Templates_Switch_On_At_Dusk_And_Off_Before_Sunrise(string template)
    {
        string dir = TempDir();
        try
        {
            JsonElement night = InitCheckSimulate(dir, template);
            (_, DateTimeOffset? off) = AssertOneDuskSwitchOn(night);
            Assert.NotNull(off);
            DateTimeOffset dawn = night.GetProperty("civilDawn").GetDateTimeOffset();
            DateTimeOffset sunrise = night.GetProperty("sunrise").GetDateTimeOffset();
            // Off again in the morning twilight, mirror image of the dusk switch-on, before the sun is up.
            Assert.InRange(off!.Value, dawn.AddMinutes(-40), sunrise);
            Assert.False(night.GetProperty("onAfterSunrise").GetBoolean());
        }
        finally
        {
            if (Directory.Exists(dir)) Directory.Delete(dir, recursive: true);
        }
    }

    [Fact]
    public void The_Site_Given_Is_Written_And_Used()
    {
        // Hobart, Tasmania, roughly (42.9° S, 147.3° E) in its summer: dusk is late and the night is short.
        string dir = TempDir();
        try
        {
            JsonElement night = InitCheckSimulate(dir, "one-shot", "--lat", "-42.9", "--lon", "147.3", "--tz", "Australia/Hobart", "--site", "Test Garden");
            AssertOneDuskSwitchOn(night);
            string scenario = File.ReadAllText(Path.Combine(dir, "one-shot.scenario.json"));
            Assert.Contains("\"latitude\": -42.9,", scenario, StringComparison.Ordinal);
            Assert.Contains("\"timeZone\": \"Australia/Hobart\"", scenario, StringComparison.Ordinal);
            Assert.Contains("Test Garden", scenario, StringComparison.Ordinal);
            // Sunset in Hobart on 20 November is after 20:00 local (daylight-saving) time (from memory).
            Assert.True(night.GetProperty("sunset").GetDateTimeOffset().Hour >= 20);
        }
        finally
        {
            if (Directory.Exists(dir)) Directory.Delete(dir, recursive: true);
        }
    }

    [Fact]
    public void Usage_Mistakes_Exit_1_And_Existing_Files_Are_Never_Overwritten()
    {
        string dir = TempDir();
        try
        {
            (int exit, _, string error) = Run("init", "--lat", "52.1", dir);
            Assert.Equal(1, exit);
            Assert.Contains("--lat, --lon and --tz together", error, StringComparison.Ordinal);
            Assert.False(Directory.Exists(dir));

            (exit, _, error) = Run("init", "--lat", "52.1", "--lon", "8.6", "--tz", "Mars/Olympus", dir);
            Assert.Equal(1, exit);
            Assert.Contains("--tz", error, StringComparison.Ordinal);

            (exit, _, _) = Run("init", "--template", "no-such-design", dir);
            Assert.Equal(1, exit);

            (exit, _, error) = Run("init", dir);
            Assert.True(exit == 0, error);
            string netlist = Path.Combine(dir, "one-shot.json");
            File.WriteAllText(netlist, "{ \"mine\": true }");
            (exit, _, error) = Run("init", dir);
            Assert.Equal(1, exit);
            Assert.Contains("already exist", error, StringComparison.Ordinal);
            Assert.Equal("{ \"mine\": true }", File.ReadAllText(netlist));
        }
        finally
        {
            if (Directory.Exists(dir)) Directory.Delete(dir, recursive: true);
        }
    }
}
