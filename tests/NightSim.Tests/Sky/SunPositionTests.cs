using NightSim.Sky;

namespace NightSim.Tests.Sky;

public sealed class SunPositionTests
{
    [Fact]
    public void MeeusExample25a_DeclinationAndRightAscension()
    {
        // Meeus, Astronomical Algorithms 2nd ed., Example 25.a: JDE 2448908.5.
        SolarCoordinates c = SunPosition.Coordinates(2448908.5);
        Assert.InRange(c.JulianCenturies, -0.072183436 - 1e-9, -0.072183436 + 1e-9);
        Assert.InRange(c.MeanLongitude, 201.80720 - 1e-4, 201.80720 + 1e-4);
        Assert.InRange(c.MeanAnomaly, 278.99397 - 1e-4, 278.99397 + 1e-4);
        Assert.InRange(c.Eccentricity, 0.016711668 - 1e-9, 0.016711668 + 1e-9);
        Assert.InRange(c.EquationOfCenter, -1.89732 - 1e-4, -1.89732 + 1e-4);
        Assert.InRange(c.ApparentLongitude, 199.90895 - 1e-4, 199.90895 + 1e-4);
        Assert.InRange(c.Obliquity, 23.43999 - 1e-4, 23.43999 + 1e-4);
        Assert.InRange(c.Declination, -7.78507 - 1e-4, -7.78507 + 1e-4);
        Assert.InRange(c.RightAscension, 198.38083 - 1e-4, 198.38083 + 1e-4);
        // Equation of time at that instant, 13.7109 min (computed from the equation-of-time series of Meeus
        // ch. 28 with the same quantities).
        Assert.InRange(c.EquationOfTime, 13.7109 - 0.001, 13.7109 + 0.001);
    }

    [Theory]
    // Meeus, Astronomical Algorithms, 2nd ed., ch. 7 (Julian Day examples).
    [InlineData(2000, 1, 1.5, 2451545.0)]
    [InlineData(1987, 1, 27.0, 2446822.5)]
    [InlineData(1988, 6, 19.5, 2447332.0)]
    [InlineData(1900, 1, 1.0, 2415020.5)]
    [InlineData(837, 4, 10.3, 2026871.8)]
    [InlineData(-4712, 1, 1.5, 0.0)]
    public void JulianDay_MeeusChapter7(int year, int month, double day, double expected)
        => Assert.InRange(SunPosition.JulianDay(year, month, day), expected - 1e-6, expected + 1e-6);

    [Fact]
    public void JulianDay_OfInstant_RoundTrips()
    {
        // 2000-01-01 12:00 UT is JD 2451545.0 (Meeus ch. 7).
        var j2000 = new DateTimeOffset(2000, 1, 1, 12, 0, 0, TimeSpan.Zero);
        Assert.Equal(2451545.0, SunPosition.JulianDay(j2000), 9);
        Assert.Equal(j2000, SunPosition.FromJulianDay(2451545.0));
    }

    [Fact]
    public void SpaWorkedExample_ElevationAndAzimuth()
    {
        // Reda & Andreas, Solar Position Algorithm, NREL/TP-560-34302, worked example:
        // 2003-10-17 12:30:30 local, UTC−7, 39.742476 N, 105.1786 W → elevation 39.872046° (no refraction), azimuth 194.340241°.
        var t = new DateTimeOffset(2003, 10, 17, 12, 30, 30, TimeSpan.FromHours(-7));
        HorizontalPosition p = SunPosition.Horizontal(t, 39.742476, -105.1786);
        Assert.InRange(p.Elevation, 39.872046 - 0.01, 39.872046 + 0.01);
        Assert.InRange(p.Azimuth, 194.340241 - 0.01, 194.340241 + 0.01);
    }

    [Fact]
    public void SignConventions_EastLongitudeShiftsNoonEarlier()
    {
        // Common practice: the Sun culminates 4 min earlier per degree of east longitude (a 14 h error shows up here).
        var site0 = new Site("g", 0, 0, TimeZoneInfo.Utc);
        var site15 = new Site("e", 0, 15, TimeZoneInfo.Utc);
        double Culmination(Site s)
        {
            double best = double.NegativeInfinity, bestT = 0;
            var day = new DateTimeOffset(2024, 3, 20, 0, 0, 0, TimeSpan.Zero);
            for (int m = 0; m < 1440; m++)
            {
                double e = SunPosition.Horizontal(day.AddMinutes(m), s.Latitude, s.Longitude).Elevation;
                if (e > best) { best = e; bestT = m; }
            }
            return bestT;
        }
        Assert.InRange(Culmination(site0) - Culmination(site15), 59, 61);
    }
}
