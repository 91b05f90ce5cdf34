using NightSim.Analysis;
using NightSim.Results;
using NightSim.Units;

namespace NightSim.Tests.Analysis;

/// <summary>
/// The supply findings on hand-made runs (invented data: a 470 nF dropper on 230 V 50 Hz, a 12 V rail Zener with a
/// 5 mA test current, a 400 Ω relay coil with 9 V pull-in and 1.2 V drop-out). The fixes' numbers are worked here from
/// the dropper's proportionality (its current grows with its capacitance) and the full-wave average 2√2/π of a
/// rectified sine's RMS (any circuits textbook).
/// </summary>
public sealed class SupplyAnalyzerTests
{
    private static readonly DateTimeOffset s_origin = new(2026, 11, 20, 12, 0, 0, TimeSpan.FromHours(1));
    private const double On = 5 * 3600.0;
    private const double MainsCurrent = 230 * 2 * Math.PI * 50 * 470e-9; // 33.96 mA, V·2πf·C

    private static SupplyFacts Supply(IReadOnlyList<RegulationLoss>? losses = null, IReadOnlyList<CoilAttempt>? attempts = null,
        RippleAtTrigger? ripple = null, Func<double, double>? railAt = null) => new()
    {
        Description = "the 470 nF dropper CX from 230 V 50 Hz",
        MainsRms = 230,
        Frequency = 50,
        DropperCapacitance = 470e-9,
        Droppers = ["CX"],
        RailPlus = "vcc",
        RailMinus = "gnd",
        ZenerId = "DZ",
        ZenerVoltage = 12,
        ZenerTestCurrent = 5e-3,
        ReservoirId = "CS",
        ReservoirCapacitance = 470e-6,
        StandbyRail = 12.05,
        StandbyZenerCurrent = 12e-3,
        StandbyMainsCurrent = MainsCurrent,
        CoilResistance = new Dictionary<string, double> { ["K1"] = 400 },
        Losses = losses ?? [],
        Attempts = attempts ?? [],
        Ripple = ripple,
        RailAt = railAt,
    };

    private static RunFacts Facts(SupplyFacts? supply, IReadOnlyList<LoadTransition>? transitions = null, IReadOnlyList<DiscreteEvent>? events = null) => new()
    {
        Origin = s_origin,
        TimeZone = TimeZoneInfo.CreateCustomTimeZone("plus1", TimeSpan.FromHours(1), "plus1", "plus1"),
        Duration = 86400,
        LoadTransitions = transitions ?? [],
        DeviceEvents = events ?? [],
        Relays = [new RelayFacts("K1", 9.0, 1.2, (_, _) => double.NaN)],
        Supply = supply,
    };

    private static DiscreteEvent Event(double t, DeviceEventKind kind, string part = "K1") => new(t, part, part, "coil", "", "", kind);

    [Fact]
    public void Regulation_Lost_While_The_Relay_Is_On_Names_The_State_The_Sag_And_A_Larger_Dropper()
    {
        var loss = new RegulationLoss(true, On + 0.01, 3600, 0, 9.1) { StateSeconds = 4 * 3600 };
        Finding f = Assert.Single(NightAnalysis.Analyze(Facts(Supply([loss]))).Findings, x => x.Code == "supply-regulation-lost");
        Assert.Equal(Severity.Warning, f.Severity);
        Assert.Equal("DZ", f.Part);
        Assert.StartsWith("Supply (the 470 nF dropper CX from 230 V 50 Hz)", f.Message, StringComparison.Ordinal);
        Assert.Contains("while relay K1 was driven from 17:00:00", f.Message, StringComparison.Ordinal);
        Assert.Contains("for 1 h in all (25 % of the time in that state)", f.Message, StringComparison.Ordinal);
        Assert.Contains("the rail sagged to 9.1 V, 2.9 V below its 12 V", f.Message, StringComparison.Ordinal);
        // By hand: the bridge hands the rail 2√2/π·33.96 mA = 30.57 mA; relay-on needs what standby used (30.57 − 12 mA),
        // the coil's 12 V/400 Ω = 30 mA and the Zener's 5 mA: 53.57 mA, so C = 470 nF·53.57/30.57 = 824 nF → E12 1 µF.
        double delivered = MainsCurrent * 2 * Math.Sqrt(2) / Math.PI;
        double c = PreferredValues.E12AtOrAbove(470e-9 * (delivered - 12e-3 + 12.0 / 400 + 5e-3) / delivered);
        Assert.Contains($"a larger dropper capacitor, about {EngineeringValue.Format(c, "F", 3)} instead of 470 nF (X2 class", f.Fix, StringComparison.Ordinal);
        // The coil may take what the Zener spares less its test current: 12 − 5 = 7 mA, a 12 V/7 mA = 1.71 kΩ coil.
        Assert.Contains($"a coil of {EngineeringValue.Format(12 / 7e-3, "Ω", 3)} or more instead of 400 Ω", f.Fix, StringComparison.Ordinal);
    }

    [Fact]
    public void A_Brief_Dip_Or_A_Loss_In_Standby_Reads_As_Such()
    {
        var dip = new RegulationLoss(true, On, 0.05, 0, 11.0) { StateSeconds = 4 * 3600 };
        Assert.DoesNotContain(NightAnalysis.Analyze(Facts(Supply([dip]))).Findings, f => f.Code == "supply-regulation-lost");
        var standby = new RegulationLoss(false, 3600, 30, 0, 11.5) { StateSeconds = 20 * 3600 };
        Finding s = Assert.Single(NightAnalysis.Analyze(Facts(Supply([standby]))).Findings, f => f.Code == "supply-regulation-lost");
        Assert.Contains("in standby (no relay driven)", s.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void A_Coil_Starved_By_The_Sag_Is_The_Supply_Not_The_Drive()
    {
        // The timer output went high and the coil was driven; the rail fell from 12 V to 4 V and the coil reached 7.5 V:
        // with the 8 V of sag it would have passed its 9 V pull-in.
        var attempt = new CoilAttempt("K1", On + 0.001, On + 3600, 12.0, 4.0, 7.5);
        DiscreteEvent[] events =
        [
            new(On, "U1.q", "U1", "output", "low", "high", DeviceEventKind.TimerOutputHigh),
            new(On + 3600, "U1.q", "U1", "output", "high", "low", DeviceEventKind.TimerOutputLow),
        ];
        RunFacts facts = Facts(Supply(attempts: [attempt]), events: events) with
        {
            Relays = [new RelayFacts("K1", 9.0, 1.2, (_, _) => 7.5)],
        };
        IReadOnlyList<Finding> findings = NightAnalysis.Analyze(facts).Findings;
        Finding f = Assert.Single(findings, x => x.Code == "supply-relay-cannot-pull-in");
        Assert.Equal(Severity.Error, f.Severity);
        Assert.Contains("relay K1 could not pull in at 17:00:00: as its coil was driven the rail sagged from 12 V to 4 V, and the coil reached only 7.5 V against its 9 V pull-in", f.Message, StringComparison.Ordinal);
        Assert.Contains("larger dropper capacitor", f.Fix, StringComparison.Ordinal);
        Assert.DoesNotContain(findings, x => x.Code == "relay-not-pulling-in");

        // The same coil on a rail that hardly moved: the drive is the fault, as before.
        var stiff = new CoilAttempt("K1", On + 0.001, On + 3600, 12.0, 11.9, 7.5);
        IReadOnlyList<Finding> drive = NightAnalysis.Analyze(facts with { Supply = Supply(attempts: [stiff]) }).Findings;
        Assert.Contains(drive, x => x.Code == "relay-not-pulling-in");
        Assert.DoesNotContain(drive, x => x.Code == "supply-relay-cannot-pull-in");
        // And without a mains-fed supply nothing supply-related is said.
        IReadOnlyList<Finding> ideal = NightAnalysis.Analyze(facts with { Supply = null }).Findings;
        Assert.Contains(ideal, x => x.Code == "relay-not-pulling-in");
        Assert.DoesNotContain(ideal, x => x.Code.StartsWith("supply-", StringComparison.Ordinal));
    }

    [Fact]
    public void A_Drop_Out_Under_Sag_Ends_The_Interval_And_The_Next_Pull_In_Is_The_Supply()
    {
        // Pulled in at On + 2 ms, the rail sagged to 2 V and the still-driven coil dropped out at On + 0.5 s; the rail
        // recovered and the coil pulled in again at On + 20 s.
        var attempt = new CoilAttempt("K1", On, On + 3600, 12.0, 2.0, 11.5);
        SupplyFacts supply = Supply(attempts: [attempt], railAt: t => t > On + 0.3 && t < On + 10 ? 2.0 : 12.0);
        RunFacts facts = Facts(supply,
            [new(On + 0.005, true, "lamp", 60, "K1"), new(On + 0.502, false, "lamp", 60, "K1"), new(On + 20.005, true, "lamp", 60, "K1")],
            [Event(On + 0.002, DeviceEventKind.CoilPulledIn), Event(On + 0.5, DeviceEventKind.CoilReleased), Event(On + 20.002, DeviceEventKind.CoilPulledIn)]);
        AnalysisResult r = NightAnalysis.Analyze(facts);
        Finding f = Assert.Single(r.Findings, x => x.Code == "supply-relay-dropout");
        Assert.Contains("dropped out at 17:00:00 while its coil was still driven: the rail had sagged to 2 V (12 V before the coil was driven)", f.Message, StringComparison.Ordinal);
        Assert.Equal("the relay dropped out under supply sag: the rail fell to 2 V while the coil was still driven", r.Intervals[0].EndedBy);
        Assert.Equal(LoadCause.Supply, r.Intervals[1].Cause);
        Assert.Contains("dropped out under supply sag at 17:00:00", r.Intervals[1].Explanation, StringComparison.Ordinal);
    }

    [Fact]
    public void Chatter_From_A_Sagging_Supply_Says_So()
    {
        var transitions = new List<LoadTransition>();
        var events = new List<DiscreteEvent>();
        for (int k = 0; k < 8; k++)
        {
            double t = On + 2.0 * k;
            transitions.Add(new(t + 0.005, true, "lamp", 60, "K1"));
            transitions.Add(new(t + 1.002, false, "lamp", 60, "K1"));
            events.Add(Event(t + 0.002, DeviceEventKind.CoilPulledIn));
            events.Add(Event(t + 1.0, DeviceEventKind.CoilReleased));
        }
        var attempt = new CoilAttempt("K1", On, On + 3600, 12.0, 1.5, 11.5);
        // The rail is low around each drop-out (the second half of every 2 s cycle).
        SupplyFacts supply = Supply(attempts: [attempt], railAt: t => (t - On) % 2.0 > 0.6 ? 1.5 : 12.0);
        AnalysisResult r = NightAnalysis.Analyze(Facts(supply, transitions, events));
        Finding chatter = Assert.Single(r.Findings, x => x.Code == "relay-chatter");
        Assert.Contains("The supply causes it (the 470 nF dropper CX from 230 V 50 Hz)", chatter.Message, StringComparison.Ordinal);
        Assert.Contains("larger dropper capacitor", chatter.Fix, StringComparison.Ordinal);
        Assert.DoesNotContain(r.Findings, x => x.Code == "supply-relay-dropout"); // the burst covers them
        Assert.Equal(LoadCause.Supply, r.Intervals[3].Cause);
    }

    [Fact]
    public void Ripple_At_The_Trigger_Is_Weighed_Against_The_Trigger_Margin()
    {
        var near = new RippleAtTrigger(3600, 0.8, 0.3, 0.4, "U1");
        Finding f = Assert.Single(NightAnalysis.Analyze(Facts(Supply(ripple: near))).Findings, x => x.Code == "supply-ripple-at-trigger");
        Assert.Equal(Severity.Warning, f.Severity);
        Assert.Contains("the rail rippled by 800 mV peak to peak and the trigger pin swung by 300 mV", f.Message, StringComparison.Ordinal);
        Assert.Contains("coming within 400 mV of it: the ripple takes 75 % of the trigger margin", f.Message, StringComparison.Ordinal);
        Assert.Contains("larger smoothing capacitor than CS's 470 µF", f.Fix, StringComparison.Ordinal);
        var far = new RippleAtTrigger(3600, 0.8, 0.3, 4.0, "U1");
        Assert.DoesNotContain(NightAnalysis.Analyze(Facts(Supply(ripple: far))).Findings, x => x.Code == "supply-ripple-at-trigger");
    }
}
