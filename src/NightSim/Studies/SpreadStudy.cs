using System.Globalization;
using NightSim.Netlist;
using NightSim.Runs;
using NightSim.Sky;

namespace NightSim.Studies;

/// <summary>
/// Monte Carlo over the parts as bought and the scenario's random events: run i draws every varied parameter uniformly
/// within its band from streams seeded by the run's seed (derived from the study seed and i), and runs the scenario
/// with that seed (weather from its mix when it states one). With corners, run 0 is nominal and runs 2j+1, 2j+2 put
/// variation j at its low and high extreme with everything else nominal; the runs after those are the combined worst
/// cases: for each quantity with a closed form (on-time, switch-on light level, the trigger pin's lowest point in noise
/// and at dusk) every band at the end that lowers it, then every band at the end that raises it
/// (<see cref="TuneCorners"/>: the signs come from the closed forms, one band at a time, so they are known before any
/// run and every run index stays independent of the others — shards and merge work as for random draws).
/// </summary>
public sealed class SpreadStudy
{
    private readonly NightRunRequest _base;
    private readonly StudyRunBuffers _buffers = new();

    public SpreadStudy(NightRunRequest request, int runs, bool corners, ulong seed)
    {
        ArgumentNullException.ThrowIfNull(request.Scenario);
        _base = request;
        Variations = ToleranceModel.For(request.Netlist);
        Corners = corners;
        Seed = seed;
        Combined = corners
            ? [.. TuneCorners.For(request.Netlist, request.Scenario, CombinedQuantities).Where(c => c.Ends.Count > 1)]
            : [];
        Total = corners ? 1 + 2 * Variations.Count + Combined.Count : runs;
    }

    /// <summary>The quantities whose combined worst cases `--corners` adds, in a fixed order.</summary>
    private static readonly string[] CombinedQuantities =
        [TunePhysics.OnTime, TunePhysics.SwitchLux, TunePhysics.NoiseLow, TunePhysics.DuskLow];

    /// <summary>With corners: the combined worst cases run after the one-band-at-a-time corners (a quantity moved by
    /// a single band only is already covered by that band's own corner).</summary>
    public IReadOnlyList<TuneCorner> Combined { get; }

    public IReadOnlyList<Variation> Variations { get; }
    public bool Corners { get; }
    public ulong Seed { get; }
    public int Total { get; }

    /// <summary>The header every output of this study carries.</summary>
    public StudyHeader Header(string tool) => new()
    {
        Kind = "spread",
        Tool = tool,
        Netlist = _base.NetlistPath,
        Scenario = _base.ScenarioPath,
        Seed = Seed,
        Total = Total,
        Settings =
        [
            new("mode", Corners ? "corners" : "random"),
            new("runs", Total.ToString(CultureInfo.InvariantCulture)),
            new("variations", string.Join(" ", Variations.Select(v => string.Create(CultureInfo.InvariantCulture, $"{v.Key}={v.Low:R}..{v.High:R}")))),
            .. Combined.Count > 0 ? [new KeyValuePair<string, string>("combined", string.Join("; ", Combined.Select(c => c.Label)))] : Array.Empty<KeyValuePair<string, string>>(),
        ],
    };

    /// <summary>Seed of run <paramref name="index"/> (53 bits, exact in every JSON reader).</summary>
    public static ulong RunSeed(ulong studySeed, int index) =>
        DeterministicRandom.ForStream(studySeed, "spread-run#" + index.ToString(CultureInfo.InvariantCulture)).NextUInt64() >> 11;

    /// <summary>The values, label, seed and sky of run <paramref name="index"/> (no simulation).</summary>
    public (ulong Seed, string Label, string? Sky, List<KeyValuePair<string, double>> Values) Draw(int index)
    {
        var values = new List<KeyValuePair<string, double>>(Variations.Count);
        if (Corners && index > 2 * Variations.Count)
        {
            TuneCorner c = Combined[index - 1 - 2 * Variations.Count];
            List<KeyValuePair<string, double>> ends = c.Values(Variations);
            foreach (Variation v in Variations)
            {
                double value = v.Nominal;
                foreach ((string key, double x) in ends) { if (key == v.Key) value = x; }
                values.Add(new(v.Key, value));
            }
            return (_base.Scenario!.Seed, "all bands: " + c.Label, null, values);
        }
        if (Corners)
        {
            string label = "nominal";
            for (int j = 0; j < Variations.Count; j++)
            {
                Variation v = Variations[j];
                double value = v.Nominal;
                if (index == 2 * j + 1) { value = v.Low; label = v.Key + " low"; }
                else if (index == 2 * j + 2) { value = v.High; label = v.Key + " high"; }
                values.Add(new(v.Key, value));
            }
            return (_base.Scenario!.Seed, label, null, values);
        }
        ulong seed = RunSeed(Seed, index);
        foreach (Variation v in Variations)
        {
            double u = DeterministicRandom.ForStream(seed, "tolerance:" + v.Key).NextDouble();
            values.Add(new(v.Key, v.At(u)));
        }
        LightScenario sc = _base.Scenario!;
        string? sky = sc.WeatherMix?.Draw(sc.Start, seed);
        return (seed, "random", sky, values);
    }

    /// <summary>The netlist and scenario of run <paramref name="index"/>.</summary>
    public NightRunRequest Request(int index)
    {
        (ulong seed, _, string? sky, List<KeyValuePair<string, double>> values) = Draw(index);
        LightScenario sc = _base.Scenario! with { Seed = seed };
        if (sky is not null) sc = sc with { Weather = sc.Weather with { SkyFactor = Weather.NamedSkyFactor(sky) } };
        return _base with { Netlist = ToleranceModel.Apply(_base.Netlist, values), Scenario = sc };
    }

    /// <summary>Runs item <paramref name="index"/>.</summary>
    public SpreadRun Run(int index)
    {
        (ulong seed, string label, string? sky, List<KeyValuePair<string, double>> values) = Draw(index);
        NightRunResult r = NightRun.Run(_buffers.ForThisThread(Request(index)));
        return new SpreadRun(index, seed, label, sky, values, StudyOutcome.From(r));
    }
}
