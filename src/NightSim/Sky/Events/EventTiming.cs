using System.Text.Json;

namespace NightSim.Sky.Events;

/// <summary>
/// When repeated events happen in each night: explicit clock times, or a seeded Poisson rate per hour between two
/// clock times (times before noon belong to the next morning).
/// </summary>
/// <param name="Times">Explicit clock times, or null.</param>
/// <param name="PerHour">Mean rate, events per hour (with From/To).</param>
/// <param name="From">Start of the rate window (clock time).</param>
/// <param name="To">End of the rate window (clock time).</param>
public sealed record EventTiming(IReadOnlyList<TimeSpan>? Times, double PerHour, TimeSpan From, TimeSpan To)
{
    /// <summary>Reads "times" or "perHour"/"from"/"to" from <paramref name="obj"/>.</summary>
    public static EventTiming? Parse(JsonElement obj, string path, ScenarioParseContext ctx)
    {
        bool hasTimes = obj.TryGetProperty("times", out _);
        bool hasRate = obj.TryGetProperty("perHour", out _);
        if (hasTimes == hasRate)
        {
            ctx.Error(path, hasTimes ? "give either \"times\" or \"perHour\", not both" : "missing \"times\" or \"perHour\"",
                "explicit: \"times\": [\"21:40\"]; seeded: \"perHour\": 3, \"from\": \"18:00\", \"to\": \"23:00\"");
            return null;
        }
        if (hasTimes)
        {
            var times = ctx.ClockList(obj, path, "times");
            if (times is not null && times.Count > InputLimits.MaxEventsPerNight)
            {
                ctx.Error($"{path}.times", $"{times.Count} times are more than the limit of {InputLimits.MaxEventsPerNight} events per night",
                    "use \"perHour\" for many events, or fewer times");
                return null;
            }
            return times is null ? null : new EventTiming(times, 0, TimeSpan.Zero, TimeSpan.Zero);
        }
        double? rate = ctx.Number(obj, path, "perHour", null, required: true, min: 0);
        TimeSpan? from = ctx.Clock(obj, path, "from", required: true);
        TimeSpan? to = ctx.Clock(obj, path, "to", required: true);
        if (rate is null || from is null || to is null) return null;
        if (NightOrder(to.Value) <= NightOrder(from.Value))
        {
            ctx.Error($"{path}.to", "\"to\" must come after \"from\" within the night (noon to noon)", "e.g. from \"18:00\" to \"06:00\"");
            return null;
        }
        double hours = (NightOrder(to.Value) - NightOrder(from.Value)).TotalHours;
        if (rate.Value * hours > InputLimits.MaxEventsPerNight)
        {
            ctx.Error($"{path}.perHour", string.Create(System.Globalization.CultureInfo.InvariantCulture,
                $"{rate.Value:G4} per hour for {hours:0.##} h would be more than the limit of {InputLimits.MaxEventsPerNight} events per night"),
                "give a realistic rate, e.g. \"perHour\": 3");
            return null;
        }
        return new EventTiming(null, rate.Value, from.Value, to.Value);
    }

    /// <summary>Clock time shifted so that the night (12:00 → 12:00) is increasing.</summary>
    public static TimeSpan NightOrder(TimeSpan clock) => clock < TimeSpan.FromHours(12) ? clock + TimeSpan.FromHours(24) : clock;

    /// <summary>Concrete run times over all nights, increasing within each night.</summary>
    public List<double> Draw(ScenarioTimeline timeline, DeterministicRandom random)
    {
        var result = new List<double>();
        for (int night = 0; night < timeline.Nights; night++)
        {
            if (Times is not null)
            {
                var nightTimes = new List<double>(Times.Count);
                foreach (TimeSpan t in Times) nightTimes.Add(timeline.ClockTime(night, t));
                nightTimes.Sort();
                result.AddRange(nightTimes);
            }
            else
            {
                var (a, b) = timeline.ClockSpan(night, From, To);
                result.AddRange(random.PoissonTimes(a, b, PerHour / 3600.0));
            }
        }
        return result;
    }
}
