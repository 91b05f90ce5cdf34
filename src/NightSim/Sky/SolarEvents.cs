namespace NightSim.Sky;

/// <summary>
/// Sun events of one night, in the site's local time with offset. The night of <see cref="Date"/> runs from local noon
/// of that date to local noon of the next; dusks are the first descending crossings after noon, dawns and sunrise the
/// first ascending crossings after the matching dusk. An event that does not happen (polar day or night, or a
/// twilight that never ends) is null — never NaN.
/// </summary>
public sealed record SolarEvents(
    DateOnly Date,
    DateTimeOffset? Sunset,
    DateTimeOffset? CivilDusk,
    DateTimeOffset? NauticalDusk,
    DateTimeOffset? AstronomicalDusk,
    DateTimeOffset? AstronomicalDawn,
    DateTimeOffset? NauticalDawn,
    DateTimeOffset? CivilDawn,
    DateTimeOffset? Sunrise);

/// <summary>The clock times at which one illuminance level is crossed in one night.</summary>
/// <param name="Lux">The level, lux.</param>
/// <param name="Dusk">Falling crossing after local noon, or null.</param>
/// <param name="Dawn">Rising crossing before the next local noon, or null.</param>
public sealed record LuxCrossing(double Lux, DateTimeOffset? Dusk, DateTimeOffset? Dawn);
