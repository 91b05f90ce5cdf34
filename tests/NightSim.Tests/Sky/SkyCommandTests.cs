using System.CommandLine;
using System.Text.Json;
using NightSim.Cli.Commands;

namespace NightSim.Tests.Sky;

public sealed class SkyCommandTests
{
    private static (int Code, string Out, string Err) Run(params string[] args)
    {
        var output = new StringWriter();
        var error = new StringWriter();
        var root = new RootCommand("test");
        root.Subcommands.Add(SkyCommand.Create(output, error));
        int code = root.Parse(args).Invoke(new InvocationConfiguration { Output = output, Error = error });
        return (code, output.ToString(), error.ToString());
    }

    [Fact]
    public void Json_HasTheDocumentedKeys()
    {
        var (code, output, _) = Run("sky", "--lat", "51.5074", "--lon", "-0.1278", "--tz", "Europe/London", "--date", "2024-06-21", "--days", "2", "--format", "json");
        Assert.Equal(0, code);
        using JsonDocument doc = JsonDocument.Parse(output);
        Assert.Equal(2, doc.RootElement.GetArrayLength());
        JsonElement night = doc.RootElement[0];
        string[] keys = ["date", "sunset", "sunrise", "civilDusk", "civilDawn", "nauticalDusk", "nauticalDawn", "astronomicalDusk", "astronomicalDawn", "luxCrossings"];
        Assert.Equal(keys.Order(), night.EnumerateObject().Select(p => p.Name).Order());
        Assert.Equal("2024-06-21", night.GetProperty("date").GetString());
        // Computed vector (NOAA solar equations after Meeus, as in TwilightTests): London 2024-06-21 sunset 20:21:40 UT = 21:21:40 BST; no astronomical dusk (null, never NaN).
        var sunset = DateTimeOffset.Parse(night.GetProperty("sunset").GetString()!, System.Globalization.CultureInfo.InvariantCulture);
        Assert.Equal(TimeSpan.FromHours(1), sunset.Offset);
        Assert.InRange((sunset - new DateTimeOffset(2024, 6, 21, 20, 21, 40, TimeSpan.Zero)).TotalSeconds, -60, 60);
        Assert.Equal(JsonValueKind.Null, night.GetProperty("astronomicalDusk").ValueKind);
        Assert.Matches(@"^\d{4}-\d\d-\d\dT\d\d:\d\d:\d\d[+-]\d\d:\d\d$", night.GetProperty("sunrise").GetString()!);
        JsonElement crossings = night.GetProperty("luxCrossings");
        Assert.Equal([100.0, 10.0, 1.0], crossings.EnumerateArray().Select(c => c.GetProperty("lux").GetDouble()).ToArray());
        // Computed with the same solar equations and the USNO Circular No. 171 model plus its 0.0005 lx term:
        // London 2024-06-21 sunset → 10 lx +36.5 min.
        var tenLux = DateTimeOffset.Parse(crossings[1].GetProperty("dusk").GetString()!, System.Globalization.CultureInfo.InvariantCulture);
        Assert.InRange((tenLux - sunset).TotalMinutes, 36.0, 37.0);
    }

    [Fact]
    public void Text_ListsEveryEventAndNoneForPolarNight()
    {
        var (code, output, _) = Run("sky", "--lat", "78.22", "--lon", "15.65", "--tz", "Europe/Oslo", "--date", "2026-12-21");
        Assert.Equal(0, code);
        foreach (string label in new[] { "sunset", "civil dusk", "nautical dusk", "astronomical dusk", "astronomical dawn", "nautical dawn", "civil dawn", "sunrise", "100 lx", "10 lx", "1 lx" })
            Assert.Contains(label, output);
        Assert.Contains("none", output);
        Assert.DoesNotContain("NaN", output);
    }

    [Fact]
    public void Bad_Option_Values_Exit_1()
    {
        var (code, _, err) = Run("sky", "--lat", "52", "--lon", "8", "--tz", "Europe/Nowhere", "--date", "2026-12-21");
        Assert.Equal(1, code);
        Assert.Contains("unknown time zone", err);
        Assert.Equal(1, Run("sky", "--lat", "95", "--lon", "8", "--tz", "UTC", "--date", "2026-12-21").Code);
        Assert.Equal(1, Run("sky", "--lat", "52", "--lon", "8", "--tz", "UTC", "--date", "21.12.2026").Code);
        Assert.Equal(1, Run("sky", "--lat", "52", "--lon", "8", "--tz", "UTC", "--date", "2026-12-21", "--format", "xml").Code);
        Assert.Equal(1, Run("sky", "--lon", "8", "--tz", "UTC", "--date", "2026-12-21").Code);
    }

    [Fact]
    public void Plot_SvgAndPng_WrittenWhole()
    {
        string dir = Path.Combine(Path.GetTempPath(), "nightsim-sky-" + Guid.NewGuid().ToString("N"));
        Directory.CreateDirectory(dir);
        try
        {
            string svg = Path.Combine(dir, "night.svg"), png = Path.Combine(dir, "night.png");
            Assert.Equal(0, Run("sky", "--lat", "52.1", "--lon", "8.6", "--tz", "Europe/Berlin", "--date", "2026-12-21", "--plot", svg).Code);
            Assert.Contains("<svg", File.ReadAllText(svg));
            Assert.Equal(0, Run("sky", "--lat", "52.1", "--lon", "8.6", "--tz", "Europe/Berlin", "--date", "2026-12-21", "--plot", png).Code);
            byte[] head = File.ReadAllBytes(png)[..8];
            Assert.Equal(new byte[] { 0x89, 0x50, 0x4E, 0x47, 0x0D, 0x0A, 0x1A, 0x0A }, head); // PNG signature (ISO/IEC 15948)
            Assert.Equal(2, Directory.GetFiles(dir).Length); // no temp files left behind
            Assert.Equal(1, Run("sky", "--lat", "52.1", "--lon", "8.6", "--tz", "UTC", "--date", "2026-12-21", "--plot", Path.Combine(dir, "x.gif")).Code);
        }
        finally
        {
            Directory.Delete(dir, recursive: true);
        }
    }
}
