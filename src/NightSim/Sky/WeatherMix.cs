using System.Text.Json;

namespace NightSim.Sky;

/// <summary>
/// How often each kind of sky comes, per calendar month: the scenario's "weatherMix". A study that runs many dates
/// (`nightsim year`) draws each night's sky from the mix of its month with a stream seeded by the scenario seed and
/// the date, so a night's weather does not depend on which other nights run.
/// </summary>
public sealed record WeatherMix
{
    /// <summary>Sky names a mix may use, in drawing order.</summary>
    public static readonly string[] SkyNames = ["clear", "thin", "cloudy", "overcast"];

    /// <summary>Twelve months (January first), each the weights of <see cref="SkyNames"/> summing to 1.</summary>
    public required IReadOnlyList<double[]> Months { get; init; }

    /// <summary>The sky name drawn for the night of <paramref name="date"/> under <paramref name="seed"/>.</summary>
    public string Draw(DateOnly date, ulong seed)
    {
        var random = DeterministicRandom.ForStream(seed, "weather-mix#" + date.DayNumber.ToString(System.Globalization.CultureInfo.InvariantCulture));
        double u = random.NextDouble();
        double[] w = Months[date.Month - 1];
        double sum = 0;
        for (int i = 0; i < w.Length; i++)
        {
            sum += w[i];
            if (u < sum) return SkyNames[i];
        }
        for (int i = w.Length - 1; i >= 0; i--) if (w[i] > 0) return SkyNames[i];
        return SkyNames[0];
    }

    /// <summary>Reads "weatherMix": one object of sky weights for every month, or an array of twelve (January first).</summary>
    public static WeatherMix? Read(JsonElement v, string path, ScenarioParseContext ctx)
    {
        var months = new List<double[]>();
        if (v.ValueKind == JsonValueKind.Object)
        {
            double[]? one = ReadMonth(v, path, ctx);
            if (one is null) return null;
            for (int m = 0; m < 12; m++) months.Add(one);
        }
        else if (v.ValueKind == JsonValueKind.Array && v.GetArrayLength() == 12)
        {
            int i = 0;
            foreach (JsonElement e in v.EnumerateArray())
            {
                string p = $"{path}[{i++}]";
                if (!ctx.ExpectObject(e, p)) return null;
                double[]? w = ReadMonth(e, p, ctx);
                if (w is null) return null;
                months.Add(w);
            }
        }
        else
        {
            ctx.Error(path, $"{ScenarioParseContext.Describe(v)} is not a weather mix",
                "write { \"clear\": 0.5, \"cloudy\": 0.3, \"overcast\": 0.2 } for every month, or an array of twelve such objects (January first)");
            return null;
        }
        return new WeatherMix { Months = months };
    }

    private static double[]? ReadMonth(JsonElement obj, string path, ScenarioParseContext ctx)
    {
        ctx.CheckProperties(obj, path, SkyNames);
        var w = new double[SkyNames.Length];
        int before = ctx.Errors.Count;
        for (int i = 0; i < SkyNames.Length; i++) w[i] = ctx.Number(obj, path, SkyNames[i], null, min: 0) ?? 0.0;
        if (ctx.Errors.Count > before) return null;
        double sum = w.Sum();
        if (!(sum > 0))
        {
            ctx.Error(path, "the weights add up to 0", "give at least one sky a weight, e.g. { \"clear\": 1 }");
            return null;
        }
        for (int i = 0; i < w.Length; i++) w[i] /= sum;
        return w;
    }
}
