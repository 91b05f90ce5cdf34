using NightSim.Sky;

namespace NightSim.Tests.Sky;

public sealed class MoonPositionTests
{
    [Fact]
    public void MeeusExample47a_LowPrecisionWithinHalfADegree()
    {
        // Meeus, Astronomical Algorithms, Example 47.a (values from memory): 1992-04-12 0h TD, JDE 2448724.5:
        // λ = 133.162655°, β = −3.229126°, α = 134.688470°, δ = 13.768368°. The low-precision series is good to ≈ 0.3°.
        var (lambda, beta) = MoonPosition.Ecliptic(2448724.5);
        Assert.InRange(lambda, 133.162655 - 0.5, 133.162655 + 0.5);
        Assert.InRange(beta, -3.229126 - 0.3, -3.229126 + 0.3);
        var (ra, dec) = MoonPosition.Equatorial(2448724.5);
        Assert.InRange(ra, 134.688470 - 0.5, 134.688470 + 0.5);
        Assert.InRange(dec, 13.768368 - 0.5, 13.768368 + 0.5);
    }

    [Fact]
    public void Phases_FullAndNewMoon2024()
    {
        // Lunar phases 2024 (USNO phases table, from memory): full Moon 2024-01-25 17:54 UT, new Moon 2024-01-11 11:57 UT.
        double full = SunPosition.JulianDay(new DateTimeOffset(2024, 1, 25, 17, 54, 0, TimeSpan.Zero));
        double @new = SunPosition.JulianDay(new DateTimeOffset(2024, 1, 11, 11, 57, 0, TimeSpan.Zero));
        Assert.True(MoonPosition.Elongation(full) > 174, $"full: {MoonPosition.Elongation(full)}");
        Assert.True(MoonPosition.Elongation(@new) < 6, $"new: {MoonPosition.Elongation(@new)}");
    }

    [Fact]
    public void Moonlight_InPublishedBands()
    {
        // Full Moon high 0.1–0.3 lx; quarter Moon ≈ 0.01 lx (common practice: widely quoted orders of magnitude, wide bands).
        Assert.InRange(IlluminanceModel.MoonLux(45, 180), 0.1, 0.3);
        Assert.InRange(IlluminanceModel.MoonLux(45, 90), 0.003, 0.03);
        Assert.True(IlluminanceModel.MoonLux(-10, 180) < 1e-3);
        Assert.Equal(IlluminanceModel.MoonLux(30, 150) / 10, IlluminanceModel.MoonLux(30, 150, 10), 12);
    }

    [Fact]
    public void ModeledMoon_BrightensAFullMoonNightOnly()
    {
        static LightProfile Night(string date) => ScenarioLoader.Parse(
            $$"""{ "site": { "latitude": 52.1, "longitude": 8.6, "timeZone": "UTC" }, "start": "{{date}}", "weather": { "moon": true } }""",
            "inline.json", null, out _)!.CreateProfile();
        // Local midnight is 12 h after noon (UTC zone). Full Moon near 2024-01-25, new Moon near 2024-01-11.
        double full = Night("2024-01-25").SkyLux(12 * 3600);
        double dark = Night("2024-01-10").SkyLux(12 * 3600);
        Assert.InRange(full, 0.05, 0.35);
        Assert.InRange(dark, 0.0005, 0.0006);
    }
}
