using System.Collections.Concurrent;
using NightSim.Analysis;
using NightSim.Netlist;
using NightSim.Runs;
using NightSim.Sky;

namespace NightSim.Tests.Runs;

/// <summary>
/// Mistakes builders make, each a netlist in data/mistakes run through a real night: the finding must name the stage
/// that failed, with its numbers, and no internal device name may reach the text.
/// </summary>
public class MistakeRunTests
{
    private static readonly ConcurrentDictionary<string, Lazy<NightRunResult>> s_runs = new();

    private static string PathOf(string name) => Path.Combine(AppContext.BaseDirectory, "data", "mistakes", name);

    private static NetlistDefinition Netlist(string name) => NetlistLoader.Load(PathOf(name + ".json"));

    private static NightRunResult Run(string name) => s_runs.GetOrAdd(name, n => new Lazy<NightRunResult>(() => NightRun.Run(new NightRunRequest
    {
        Netlist = Netlist(n),
        NetlistPath = n + ".json",
        Scenario = ScenarioLoader.LoadOrThrow(PathOf(n + ".scenario.json")),
        ScenarioPath = n + ".scenario.json",
    }))).Value;

    /// <summary>Every text a user reads: findings, fixes, and how each on-period began and ended.</summary>
    private static IEnumerable<string> Texts(NightRunResult r) =>
        r.Analysis.Findings.SelectMany(f => new[] { f.Message, f.Fix ?? "" })
            .Concat(r.Analysis.Nights.SelectMany(n => n.LoadOn).SelectMany(l => new[] { l.EndedBy, l.Explanation }));

    private static void NoInternalNames(NightRunResult r)
    {
        foreach (string text in Texts(r))
        {
            Assert.DoesNotMatch(@"\b[A-Z]+[0-9]*\.[a-z]", text);
        }
    }

    // A 12 V relay with a 400 Ω coil hung straight on a CMOS timer output that sources through 150 Ω: the coil gets
    // 12 V · 400 / (400 + 150) = 8.73 V (voltage divider, Ohm's law; common practice) against its 9 V pull-in, so the
    // contacts never close although the trigger and the timer worked.
    [Fact]
    public void RelayOnACmosOutputIsTheRelayDriveStage()
    {
        NightRunResult r = Run("relay-from-cmos-output");
        Finding f = Assert.Single(r.Analysis.Findings, f => f.Code == "relay-not-pulling-in");
        double coil = 12.0 * 400.0 / (400.0 + 150.0);
        Assert.Contains($"the coil reached only {coil:0.00} V against its 9.0 V pull-in", f.Message, StringComparison.Ordinal);
        Assert.Equal("K1", f.Part);
        Assert.Contains("transistor", f.Fix, StringComparison.Ordinal);
        Assert.DoesNotContain(r.Analysis.Findings, f => f.Code == "missed-night");
        Assert.True(r.Analysis.Nights[0].Missed);
        NoInternalNames(r);
    }

    // The sensor divider wired straight to the trigger pin holds it below a third of the supply all night; the output
    // follows the trigger (a 555 output stays high while its trigger is held low, whatever the threshold does; common
    // practice). The timing period is ln 3 · 1 MΩ · 1000 µF = 1098.6 s = 18 min 19 s (555 monostable relation, common
    // practice; the netlist's capacitor has no leakage and the CMOS timer's input current is picoamperes).
    [Fact]
    public void TriggerWiredDirectlyIsHeldAndReleasedByTheHeadlight()
    {
        NightRunResult r = Run("trigger-direct");
        List<Finding> held = r.Analysis.Findings.Where(f => f.Code == "trigger-held").ToList();
        Assert.NotEmpty(held);
        Assert.All(held, f => Assert.Contains("longer than its timing period of 18 min 19 s", f.Message, StringComparison.Ordinal));

        // The first on-period began at dusk and ended when the 19:30 headlights lit the sensor and released the
        // trigger: not "timer ran out".
        LoadInterval first = r.Analysis.Nights[0].LoadOn[0];
        Assert.NotNull(first.End);
        Assert.InRange(first.End!.Value.TimeOfDay.TotalSeconds, 19.5 * 3600, 19.5 * 3600 + 2);
        Assert.DoesNotContain("ran out", first.EndedBy, StringComparison.Ordinal);
        Assert.StartsWith("timer U1's trigger input was released by headlight pass", first.EndedBy, StringComparison.Ordinal);
        Assert.EndsWith("at 19:30:00", first.EndedBy, StringComparison.Ordinal);
        // The on-time check stays, but only as information: the trigger, not the timer, ended that period.
        Assert.Contains(r.Analysis.Findings, f => f.Code == "on-time" && f.Severity == Severity.Info && f.Message.Contains("released by headlight pass", StringComparison.Ordinal));
        string heldFor = Wording.Duration(first.End.Value.Subtract(first.Start).TotalSeconds);
        Assert.Contains($"for {heldFor} from {Wording.Clock(first.Start)}", held[0].Message, StringComparison.Ordinal);
        NoInternalNames(r);
    }

    // Midsummer at 61.5° N: at midnight the sun is 90° − 61.5° − 23.44° = 5.06° below the horizon (noon/midnight
    // altitude from latitude and declination; the June solstice declination 23.44°, from memory), above the −6° of
    // civil twilight, so the night never gets darker than civil twilight. The design switches on below the level
    // its divider sets: the comparator (reference 6 V, 0.5 V hysteresis band centred on it) goes high when the sensor
    // node rises above 6.25 V, i.e. with a 53 kΩ upper leg when the photoresistor reaches 53 kΩ · 6.25 / 5.75
    // (divider), R_law = 1/(1/R − 1/2 MΩ) without its dark resistance, and lux = 10 · (R_law / 15 kΩ)^(−1/0.7)
    // (photoconductor power law R = R10 · (E/10 lx)^−γ, common practice).
    [Fact]
    public void MidsummerFarNorthIsNeverDarkEnough()
    {
        NightRunResult r = Run("june-61-north");
        Assert.Null(r.Analysis.Nights[0].CivilDusk);
        Finding f = Assert.Single(r.Analysis.Findings, f => f.Code == "never-dark-enough");
        Assert.DoesNotContain(r.Analysis.Findings, f => f.Code == "missed-night");

        double cell = 53e3 * 6.25 / 5.75;
        double law = 1.0 / (1.0 / cell - 1.0 / 2e6);
        double level = 10.0 * Math.Pow(law / 15e3, -1.0 / 0.7);
        Assert.NotNull(r.Facts.Sensor?.SwitchingLux);
        Assert.Equal(level, r.Facts.Sensor!.SwitchingLux!.Value, 0.01);

        // The darkest light at the sensor, scanned minute by minute over the night here (independent of the analyser's
        // own search), must be what the message names, and well above the switching level.
        NightWindow night = r.Facts.Nights[0];
        double darkest = double.PositiveInfinity;
        for (double t = night.From; t <= Math.Min(night.To, r.Facts.Duration); t += 60) darkest = Math.Min(darkest, r.Facts.SensorLux!(t));
        Assert.InRange(darkest, 2 * level, 10 * level);
        Assert.Matches(@"never fell below [0-9.]+ lx \(darkest at 0[0-2]:[0-9:]+\) against the circuit's switching level of [0-9.]+ lx", f.Message);
        double stated = double.Parse(System.Text.RegularExpressions.Regex.Match(f.Message, @"below ([0-9.]+) lx").Groups[1].Value, System.Globalization.CultureInfo.InvariantCulture);
        Assert.Equal(darkest, stated, 0.01 * darkest + 0.005);
        Assert.Contains($"switching level of {level:0.#}", f.Message, StringComparison.Ordinal);
        Assert.Contains($"never darker than {stated:0.##} lx", f.Fix, StringComparison.Ordinal);
        NoInternalNames(r);
    }

    // 3.3 MΩ built as 1.65 MΩ + 1.65 MΩ in series is the same timing network as one 3.3 MΩ: the on-time check against
    // the closed form appears for both, with the same numbers. ln 3 · 3.3 MΩ · 3300 µF = 11 964 s without the
    // capacitor's leakage (555 monostable relation, common practice).
    [Fact]
    public void TimingResistorInSeriesKeepsTheOnTimeCheck()
    {
        NightRunResult series = Run("timing-resistor-series"), single = Run("timing-resistor-single");
        TimerFacts a = Assert.Single(series.Facts.Timers), b = Assert.Single(single.Facts.Timers);
        Assert.Equal(3.3e6, a.Resistance, 1);
        Assert.Equal(Math.Log(3) * 3.3e6 * 3300e-6, a.IdealWidth, 1);
        Assert.Equal(b.ClosedFormWidth, a.ClosedFormWidth, 1e-6 * b.ClosedFormWidth);
        Finding fa = Assert.Single(series.Analysis.Findings, f => f.Code == "on-time");
        Finding fb = Assert.Single(single.Analysis.Findings, f => f.Code == "on-time");
        Assert.Equal(fb.Message, fa.Message);
        Assert.Contains($"closed form with leakage gives {Wording.Duration(a.ClosedFormWidth)}", fa.Message, StringComparison.Ordinal);
    }
}
