using NightSim.Sky;

namespace NightSim.Tests.Sky;

public sealed class TwilightTests
{
    private static readonly TimeZoneInfo s_berlin = TimeZoneInfo.FindSystemTimeZoneById("Europe/Berlin");

    private static void Near(string expectedUtc, DateTimeOffset? actual, double toleranceSeconds = 60)
    {
        Assert.NotNull(actual);
        var expected = DateTimeOffset.Parse(expectedUtc, System.Globalization.CultureInfo.InvariantCulture);
        double diff = Math.Abs((actual!.Value - expected).TotalSeconds);
        Assert.True(diff <= toleranceSeconds, $"expected {expectedUtc}, got {actual:O} ({diff:F1} s off)");
    }

    [Theory]
    // Reda & Andreas, Solar Position Algorithm, NREL/TP-560-34302, Table A2.1, 0° E, UT, ±60 s. Sunrise of a date is the morning of the previous night.
    [InlineData(35.0, "1994-01-02", "16:59:55.9", "07:08:12.8")]
    [InlineData(-35.0, "1996-07-05", "17:01:04.5", "07:08:15.4")]
    [InlineData(-35.0, "2004-12-04", "19:02:02.5", "04:38:57.1")]
    public void SunriseSunset_NrelTableA21(double lat, string date, string set, string rise)
    {
        var site = new Site("t", lat, 0.0, TimeZoneInfo.Utc);
        var d = DateOnly.Parse(date, System.Globalization.CultureInfo.InvariantCulture);
        Near($"{date}T{set}Z", Twilight.ForNight(site, d).Sunset);
        Near($"{date}T{rise}Z", Twilight.ForNight(site, d.AddDays(-1)).Sunrise);
    }

    [Fact]
    public void Golden_2003_10_17_AllEvents()
    {
        // Computed vectors, not read from an almanac: the NOAA solar calculation equations (after Meeus, Astronomical
        // Algorithms, 2nd ed., ch. 25 and 28), iterated to the instant the Sun's centre reaches −0.8333° (rise and set, USNO
        // Almanac for Computers, 1990), −6°, −12° and −18° (civil, nautical, astronomical twilight: AMS Glossary of
        // Meteorology). They pin the same published equations the code implements; ±60 s is the ≈ 1 min rise/set accuracy
        // NOAA states for those equations.
        // Sunrise 06:12:43 is also the published sunrise of the SPA worked example (Reda & Andreas, NREL/TP-560-34302).
        // Zone UTC−7: dusk side of 2003-10-17.
        var site = new Site("Golden", 39.742476, -105.1786, TimeZoneInfo.CreateCustomTimeZone("UTC-7", TimeSpan.FromHours(-7), "UTC-7", "UTC-7"));
        SolarEvents n = Twilight.ForNight(site, new DateOnly(2003, 10, 17));
        Near("2003-10-17T17:18:51-07:00", n.Sunset);
        Near("2003-10-17T17:46:04-07:00", n.CivilDusk);
        Near("2003-10-17T18:17:22-07:00", n.NauticalDusk);
        Near("2003-10-17T18:48:34-07:00", n.AstronomicalDusk);
        // Dawn side of 2003-10-17 is the morning of the night of 2003-10-16.
        SolarEvents m = Twilight.ForNight(site, new DateOnly(2003, 10, 16));
        Near("2003-10-17T04:42:53-07:00", m.AstronomicalDawn);
        Near("2003-10-17T05:14:08-07:00", m.NauticalDawn);
        Near("2003-10-17T05:45:28-07:00", m.CivilDawn);
        Near("2003-10-17T06:12:43-07:00", m.Sunrise);
    }

    [Theory]
    // Computed vectors, not read from an almanac: the NOAA solar calculation equations (after Meeus, Astronomical
    // Algorithms, 2nd ed., ch. 25 and 28), iterated to the instant the Sun's centre reaches −0.8333° (rise and set, USNO
    // Almanac for Computers, 1990), −6°, −12° and −18° (civil, nautical, astronomical twilight: AMS Glossary of
    // Meteorology). They pin the same published equations the code implements; ±60 s is the ≈ 1 min rise/set accuracy
    // NOAA states for those equations.
    // London 51.5074 N 0.1278 W, UT.
    [InlineData("2024-12-21", "15:53:40", "16:34:00", "17:17:13", "17:58:02", "05:59:38", "06:40:27", "07:23:40", "08:04:00")]
    [InlineData("2024-03-20", "18:14:20", "18:47:43", "19:27:13", "20:08:24", "04:08:44", "04:49:41", "05:29:00", "06:02:17")]
    public void London_TwilightVectors(string date, string set, string cd, string nd, string ad, string aw, string nw, string cw, string rise)
    {
        var site = new Site("London", 51.5074, -0.1278, TimeZoneInfo.Utc);
        var d = DateOnly.Parse(date, System.Globalization.CultureInfo.InvariantCulture);
        SolarEvents n = Twilight.ForNight(site, d);
        Near($"{date}T{set}Z", n.Sunset);
        Near($"{date}T{cd}Z", n.CivilDusk);
        Near($"{date}T{nd}Z", n.NauticalDusk);
        Near($"{date}T{ad}Z", n.AstronomicalDusk);
        SolarEvents m = Twilight.ForNight(site, d.AddDays(-1));
        Near($"{date}T{aw}Z", m.AstronomicalDawn);
        Near($"{date}T{nw}Z", m.NauticalDawn);
        Near($"{date}T{cw}Z", m.CivilDawn);
        Near($"{date}T{rise}Z", m.Sunrise);
    }

    [Fact]
    public void London_Midsummer_AstronomicalTwilightNeverEnds()
    {
        // Computed as above: London 2024-06-21 never reaches −18°, so it has no astronomical dusk or dawn ("none", never NaN).
        var site = new Site("London", 51.5074, -0.1278, TimeZoneInfo.Utc);
        SolarEvents n = Twilight.ForNight(site, new DateOnly(2024, 6, 21));
        Near("2024-06-21T20:21:40Z", n.Sunset);
        Near("2024-06-21T21:09:26Z", n.CivilDusk);
        Near("2024-06-21T22:24:05Z", n.NauticalDusk);
        Assert.Null(n.AstronomicalDusk);
        Assert.Null(n.AstronomicalDawn);
        SolarEvents m = Twilight.ForNight(site, new DateOnly(2024, 6, 20));
        Near("2024-06-21T01:40:44Z", m.NauticalDawn);
        Near("2024-06-21T02:55:24Z", m.CivilDawn);
        Near("2024-06-21T03:43:11Z", m.Sunrise);
    }

    [Fact]
    public void PolarDay_NoEventsAtAll()
    {
        // 69.65 N at the June solstice: the Sun stays above the horizon (polar day; declination 23.44° > 90° − 69.65° + 0.83°).
        var site = new Site("north", 69.65, 18.96, TimeZoneInfo.FindSystemTimeZoneById("Europe/Oslo"));
        SolarEvents n = Twilight.ForNight(site, new DateOnly(2026, 6, 21));
        Assert.Null(n.Sunset);
        Assert.Null(n.Sunrise);
        Assert.Null(n.CivilDusk);
        Assert.Null(n.AstronomicalDawn);
    }

    [Fact]
    public void PolarNight_NoSunriseButTwilight()
    {
        // 78.22 N at the December solstice: noon elevation ≈ 90 − 78.22 − 23.44 = −11.66°, so no sunrise/sunset and no civil
        // twilight limit, but the Sun does cross −12° (nautical) and −18° (astronomical) (geometry of the solstice, Meeus ch. 13).
        var site = new Site("far north", 78.22, 15.65, TimeZoneInfo.FindSystemTimeZoneById("Europe/Oslo"));
        SolarEvents n = Twilight.ForNight(site, new DateOnly(2026, 12, 21));
        Assert.Null(n.Sunset);
        Assert.Null(n.Sunrise);
        Assert.Null(n.CivilDusk);
        Assert.Null(n.CivilDawn);
        Assert.NotNull(n.NauticalDusk);
        Assert.NotNull(n.NauticalDawn);
        Assert.NotNull(n.AstronomicalDusk);
    }

    [Fact]
    public void SpringForwardNight_Is23HoursAndSunriseMovesOneHour()
    {
        // EU rule (Directive 2000/84/EC): clocks go forward at 01:00 UTC on the last Sunday of March — 2026-03-29.
        var site = new Site("garden", 52.1, 8.6, s_berlin);
        var (start, end) = Twilight.NightWindow(site, new DateOnly(2026, 3, 28));
        Assert.Equal(23.0, (end - start).TotalHours, 9);
        SolarEvents before = Twilight.ForNight(site, new DateOnly(2026, 3, 27));
        SolarEvents across = Twilight.ForNight(site, new DateOnly(2026, 3, 28));
        Assert.Equal(TimeSpan.FromHours(1), before.Sunrise!.Value.Offset);
        Assert.Equal(TimeSpan.FromHours(2), across.Sunrise!.Value.Offset);
        Assert.Equal(TimeSpan.FromHours(1), across.Sunset!.Value.Offset);
        // In UT the sunrise moves by about 2 minutes a day at 52 N in late March (not by an hour).
        double shift = (across.Sunrise.Value - before.Sunrise.Value).TotalMinutes - 1440;
        Assert.InRange(shift, -3.0, -1.0);
        // On the clock it moves by about +1 h.
        double clockShift = (across.Sunrise.Value.TimeOfDay - before.Sunrise.Value.TimeOfDay).TotalMinutes;
        Assert.InRange(clockShift, 57, 59);
    }

    [Fact]
    public void FallBackNight_Is25Hours()
    {
        // EU rule: clocks go back at 01:00 UTC on the last Sunday of October — 2026-10-25.
        var site = new Site("garden", 52.1, 8.6, s_berlin);
        var (start, end) = Twilight.NightWindow(site, new DateOnly(2026, 10, 24));
        Assert.Equal(25.0, (end - start).TotalHours, 9);
        SolarEvents n = Twilight.ForNight(site, new DateOnly(2026, 10, 24));
        Assert.Equal(TimeSpan.FromHours(2), n.Sunset!.Value.Offset);
        Assert.Equal(TimeSpan.FromHours(1), n.Sunrise!.Value.Offset);
        Assert.True(n.Sunset < n.CivilDusk && n.CivilDusk < n.NauticalDusk && n.NauticalDusk < n.AstronomicalDusk);
        Assert.True(n.AstronomicalDawn < n.NauticalDawn && n.NauticalDawn < n.CivilDawn && n.CivilDawn < n.Sunrise);
    }

    [Theory]
    // Computed vectors: minutes from sunset until the clear-sky USNO Circular No. 171 model plus its 0.0005 lx term falls
    // to 10 lx, the Sun from the NOAA solar equations after Meeus (as above); ±0.5 min.
    [InlineData(39.742476, -105.1786, 2003, 10, 17, 21.3)]
    [InlineData(51.5074, -0.1278, 2024, 12, 21, 31.8)]
    [InlineData(51.5074, -0.1278, 2024, 6, 21, 36.5)]
    public void SunsetTo10Lux_SteepnessOfDusk(double lat, double lon, int y, int m, int d, double minutes)
    {
        var site = new Site("s", lat, lon, TimeZoneInfo.Utc);
        var date = new DateOnly(y, m, d);
        SolarEvents n = Twilight.ForNight(site, date);
        LuxCrossing c = Twilight.LuxCrossings(site, date, [10.0])[0];
        Assert.InRange((c.Dusk!.Value - n.Sunset!.Value).TotalMinutes, minutes - 0.5, minutes + 0.5);
    }
}
