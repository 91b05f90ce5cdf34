using NightSim.Sky;

namespace NightSim.Tests.Sky;

public sealed class IlluminanceModelTests
{
    [Theory]
    // USNO Circular No. 171 (Janiczek & DeYoung, 1987) illuminance model, Sun only, sky 1: values computed from the
    // published formula, not read from the circular's tables; ±0.5 %.
    [InlineData(60, 103000)]
    [InlineData(30, 51320)]
    [InlineData(10, 11230)]
    [InlineData(5, 4252)]
    [InlineData(2, 1946)]
    [InlineData(0, 984.5)]
    [InlineData(-1, 386.8)]
    [InlineData(-2, 169.0)]
    [InlineData(-3, 66.40)]
    [InlineData(-4, 24.44)]
    [InlineData(-5, 8.652)]
    [InlineData(-6, 2.992)]
    [InlineData(-8, 0.3447)]
    [InlineData(-10, 0.03886)]
    [InlineData(-12, 4.37e-3)]
    public void SunLux_MatchesCircular171Table(double elevation, double lux)
        => Assert.InRange(IlluminanceModel.SunLux(elevation), lux * 0.995, lux * 1.005);

    [Fact]
    public void NightFloor_AddsHalfMillilux()
    {
        // Same model and computation: E(−12°) = 4.87e-3 lx including the circular's 0.0005 lx night-sky term.
        Assert.InRange(IlluminanceModel.SkyLux(-12), 4.87e-3 * 0.99, 4.87e-3 * 1.01);
        Assert.Equal(0.0005, IlluminanceModel.SkyLux(-40), 6);
    }

    [Fact]
    public void EndOfCivilTwilight_InsidePublishedBand()
    {
        // AMS Glossary of Meteorology: end of civil twilight 2–3.5 lx (American Meteorological Society).
        double e = IlluminanceModel.SkyLux(-6.0);
        Assert.InRange(e, 2.0, 3.5);
    }

    [Fact]
    public void Overcast_DividesExactly()
    {
        // USNO Circular 171: E(h, sky 10) = E(h, 1)/10.
        foreach (double h in new[] { 20.0, 0.0, -3.0, -7.0 })
            Assert.Equal(IlluminanceModel.SkyLux(h) / 10.0, IlluminanceModel.SkyLux(h, 10.0), 12);
    }

    [Fact]
    public void BranchJoint_EachBranchMatchesItsPublishedValues()
    {
        // USNO Circular 171 (Janiczek & DeYoung, 1987), model evaluated from its published formula: the day branch
        // (refraction term) gives 984.5 lx at 0°, the twilight branch 386.8 lx at −1° and 435.7 lx at −0.84°, and the
        // day branch ≈ 662 lx just above −5/6°. The joined curve equals each branch outside the band.
        Assert.InRange(IlluminanceModel.Branch(0, refraction: true), 984.5 * 0.995, 984.5 * 1.005);
        Assert.InRange(IlluminanceModel.Branch(-0.84, refraction: false), 435.7 * 0.995, 435.7 * 1.005);
        Assert.InRange(IlluminanceModel.Branch(-0.833, refraction: true), 662 * 0.98, 662 * 1.02);
        Assert.InRange(IlluminanceModel.Branch(-1, refraction: false), 386.8 * 0.995, 386.8 * 1.005);
        foreach (double h in new[] { -3.0, -1.5, IlluminanceModel.BlendLowElevation })
            Assert.Equal(IlluminanceModel.Branch(h, refraction: false), IlluminanceModel.SunLux(h), 12);
        foreach (double h in new[] { IlluminanceModel.BlendHighElevation, -0.5, 0.0, 5.0 })
            Assert.Equal(IlluminanceModel.Branch(h, refraction: true), IlluminanceModel.SunLux(h), 12);
        // Inside the band the joint lies between the two branches.
        double mid = IlluminanceModel.SunLux(IlluminanceModel.RefractionSwitchElevation);
        Assert.InRange(mid, IlluminanceModel.Branch(IlluminanceModel.RefractionSwitchElevation, false),
            IlluminanceModel.Branch(IlluminanceModel.RefractionSwitchElevation, true));
    }

    [Fact]
    public void BranchJoint_IsContinuousWithContinuousSlope()
    {
        // The published model steps by ≈ 34 % at −5/6° (same source); the joined curve changes by less than 0.05 % per
        // 0.0001° anywhere from −2° to +1° (a step would show as one large ratio), and its logarithmic slope changes
        // smoothly (no kink at the band edges: second differences stay small).
        double prev = IlluminanceModel.SunLux(-2.0), prevSlope = double.NaN;
        const double dh = 1e-4;
        for (double h = -2.0 + dh; h <= 1.0; h += dh)
        {
            double e = IlluminanceModel.SunLux(h);
            double slope = Math.Log(e / prev) / dh;
            Assert.InRange(e / prev, 1.0, 1.0005);
            if (!double.IsNaN(prevSlope)) Assert.True(Math.Abs(slope - prevSlope) < 0.01, $"slope jumps at {h}°: {prevSlope} → {slope} per degree");
            prev = e;
            prevSlope = slope;
        }
    }

    [Fact]
    public void IncreasesWithElevation()
    {
        double prev = 0;
        for (double h = -30; h <= 90; h += 0.1)
        {
            double e = IlluminanceModel.SkyLux(h);
            Assert.True(e >= prev, $"decreases at {h}");
            prev = e;
        }
    }

    [Theory]
    // Elevation where the USNO Circular No. 171 model plus its 0.0005 lx term reaches a level, solved numerically from
    // the published formula (computed); ±0.05°.
    [InlineData(10.0, 1.0, -4.86)]
    [InlineData(10.0, 2.0, -4.20)]
    [InlineData(10.0, 3.0, -3.80)]
    [InlineData(10.0, 10.0, -2.57)]
    [InlineData(10.76, 1.0, -4.79)]
    [InlineData(16.1, 1.0, -4.41)]
    [InlineData(16.1, 10.0, -2.06)]
    [InlineData(28.0, 1.0, -3.87)]
    public void ElevationForLux_Table(double lux, double sky, double elevation)
        => Assert.InRange(IlluminanceModel.ElevationForLux(lux, sky), elevation - 0.05, elevation + 0.05);
}
