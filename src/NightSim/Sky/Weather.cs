using NightSim.Sky.Events;

namespace NightSim.Sky;

/// <summary>
/// Weather of a scenario. <see cref="SkyFactor"/> divides the Sun and night-floor terms of the USNO Circular 171 model
/// (1 clear, 2 thin cloud, 3 average cloud, 10 dark stratus). <see cref="MoonLux"/> is a constant open-sky moonlight
/// level (full Moon high ≈ 0.1–0.3 lx, quarter ≈ 0.01 lx; common practice), also divided by the sky factor.
/// <see cref="FloorLux"/> is a light floor at the sensor (street lighting), added on every channel. With
/// <see cref="ModeledMoon"/> the Moon's position and phase are computed (<see cref="MoonPosition"/>) and its light
/// comes from the Circular 171 moonlight formula (<see cref="IlluminanceModel.MoonLux"/>) instead of a constant.
/// </summary>
public sealed record Weather(double SkyFactor, CloudDefinition? Clouds, double MoonLux, double FloorLux, bool ModeledMoon = false)
{
    /// <summary>Clear sky, no clouds, no Moon, no floor.</summary>
    public static Weather Clear { get; } = new(1.0, null, 0.0, 0.0);

    /// <summary>Sky factor for a named sky ("clear" 1, "thin" 2, "cloudy" 3, "overcast" 10), or NaN.</summary>
    public static double NamedSkyFactor(string name) => name switch
    {
        "clear" => 1.0,
        "thin" => 2.0,
        "cloudy" => 3.0,
        "overcast" => 10.0,
        _ => double.NaN,
    };
}

/// <summary>A light channel: a sensor position seeing <see cref="Exposure"/> of the open-sky illuminance.</summary>
/// <param name="Name">Channel name ("sensor" is the default).</param>
/// <param name="Exposure">Fraction of open-sky illuminance the sensor sees (facing down, under eaves, north wall), 0…1+.</param>
public sealed record LightChannel(string Name, double Exposure);
