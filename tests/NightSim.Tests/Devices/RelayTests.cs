using NightSim.Devices;
using NightSim.Devices.Roles;
using NightSim.Netlist;
using NightSim.Results;
using NightSim.Transient;

namespace NightSim.Tests.Devices;

public sealed class RelayTests
{
    // Generic 12 V relay class (common practice): 400 Ω, operate ≤ 10 ms, release ≤ 5 ms; coil inductance 0.5 H from
    // memory (the defaults of RelaySettings), at the class limits must-operate 9.0 V (75 %) and must-release 1.2 V (10 %).
    private static readonly RelaySettings s_class = new() { PullIn = 9.0, DropOut = 1.2 };

    private static Relay Make(RelaySettings? settings = null, string? load = null) =>
        new("K1", "K1", "c", "gnd",
        [
            new RelayContact("no", "com", "no", false),
            new RelayContact("nc", "com", "nc", true),
        ],
        (settings ?? s_class) with { LoadName = load, LoadPower = load is null ? 0 : 60.0 });

    [Fact]
    public void Coil_And_Contacts_Stamp_Their_Jacobians()
    {
        var h = new StampHarness("c", "com", "no", "nc");
        Relay k = Make();
        k.Setup(h);
        k.PowerUp();
        double[] x = [12.0, 5.0, 1.0, 2.0, 0.02];
        LoadContext at = h.Load(k, x);
        Assert.Equal(12.0 - 400.0 * 0.02, at.J[4], 12);          // branch: V_a − V_b − R·i
        Assert.Equal(-0.5 * 0.02, at.Q[4], 12);                   // −L·i
        Assert.Equal((5.0 - 2.0) / 0.05, at.J[3] * -1, 6);        // nc contact closed at power-up
        h.AssertJacobians(k, x);
    }

    [Fact]
    public void Pull_In_And_Drop_Out_Act_On_Coil_Current_With_Travel_Times()
    {
        var h = new StampHarness("c", "com", "no", "nc");
        Relay k = Make();
        k.Setup(h);
        k.PowerUp();
        var ctx = new LoadContext(h.Unknowns, h.SlotCount) { Time = 1.0 };
        var sink = new BlockBench.Sink();
        ctx.X[4] = 9.0 / 400.0 - 1e-6;
        Assert.True(k.EventValue(0, ctx) < 0);
        ctx.X[4] = 9.0 / 400.0 + 1e-6;
        Assert.True(k.EventValue(0, ctx) > 0);
        k.OnEvent(0, ctx, sink);
        Assert.True(k.IsEnergised);
        Assert.False(k.IsOperated);
        Assert.Equal([1.003], sink.Breakpoints);
        Assert.True(k.EventValue(0, ctx) < 0);                    // now waits for drop-out at 3 mA
        ctx.Time = 1.003;
        Assert.True(k.EventValue(1, ctx) >= 0);
        k.OnEvent(1, ctx, sink);
        Assert.True(k.IsOperated);
        Assert.True(k.IsContactClosed(0));
        Assert.False(k.IsContactClosed(1));
        Assert.Equal(["K1 coil released->pulled in", "K1 contact no open->closed", "K1 contact nc closed->open"], sink.Changes);
        ctx.X[4] = 1.2 / 400.0 - 1e-6;
        Assert.True(k.EventValue(0, ctx) > 0);
    }

    // Slow coil ramp 0 → 12 V → 0 at 1 V/s: the coil current lags the voltage by τ = L/R = 1.25 ms, so it reaches the
    // pull-in current 9.0 V/400 Ω at t = 9 s + τ and falls to the drop-out current 1.2 V/400 Ω at t = 22.8 s + τ
    // (ramp response of an R-L, circuit theory); contacts follow after the operate (3 ms) and release (2 ms) travel.
    [Fact]
    public void Slow_Coil_Ramp_Pulls_In_At_Pull_In_And_Drops_At_Drop_Out()
    {
        const double tau = 0.5 / 400.0;
        SimulationResult r = BlockBench.Run(
        [
            BlockBench.Pwl("VC", "c", (0, 0), (12, 12), (24, 0)),
            BlockBench.Dc("VS", "com", 12.0),
            new Resistor("RNO", "RNO", "no", "gnd", 1e3),
            new Resistor("RNC", "RNC", "nc", "gnd", 1e3),
            Make(load: "lamp"),
        ], 26.0);
        List<DiscreteEvent> coil = r.Events.Where(e => e.Signal == "coil").ToList();
        Assert.Equal(2, coil.Count);
        Assert.Equal(9.0 + tau, coil[0].Time, 1e-5);
        Assert.Equal("pulled in", coil[0].To);
        Assert.Equal(22.8 + tau, coil[1].Time, 1e-5);
        Assert.Equal("released", coil[1].To);
        Assert.Equal(9.0 + tau + 3e-3, Assert.Single(BlockBench.Times(r, "K1", "contact no", "closed")), 1e-5);
        Assert.Equal(22.8 + tau + 2e-3, Assert.Single(BlockBench.Times(r, "K1", "contact no", "open")), 1e-5);
        Assert.Single(BlockBench.Times(r, "K1", "load lamp", "on"));
        Assert.Single(BlockBench.Times(r, "K1", "load lamp", "off"));
        // Contacts: no closed between, nc closed outside (12 V through 0.05 Ω into 1 kΩ).
        Assert.Equal(12.0, r.Trace("no")!.At(15.0), 1e-2);
        Assert.Equal(0.0, r.Trace("nc")!.At(15.0), 1e-6);
        Assert.Equal(12.0, r.Trace("nc")!.At(25.0), 1e-2);
    }

    // A 12 V step closes the contacts within the class operate time of 10 ms (common practice):
    // τ·ln(4) = 1.73 ms to reach 22.5 mA of 30 mA, plus 3 ms travel. Held at 1.3 V it holds; at 1.1 V it releases.
    [Fact]
    public void Step_Operates_Within_10ms_And_Holds_Until_Below_Drop_Out()
    {
        SimulationResult r = BlockBench.Run(
        [
            BlockBench.Pwl("VC", "c", (0, 0), (0.01, 0), (0.01 + 1e-6, 12), (0.1, 12), (0.1 + 1e-3, 1.3), (0.2, 1.3), (0.2 + 1e-3, 1.1)),
            BlockBench.Dc("VS", "com", 12.0),
            new Resistor("RNO", "RNO", "no", "gnd", 1e3),
            Make(),
        ], 0.3);
        List<double> closed = BlockBench.Times(r, "K1", "contact no", "closed");
        Assert.Single(closed);
        Assert.InRange(closed[0] - 0.01, 0.0, 10e-3);
        Assert.Equal(0.01 + 0.5 / 400.0 * Math.Log(4.0) + 3e-3, closed[0], 1e-5);
        List<double> open = BlockBench.Times(r, "K1", "contact no", "open");
        Assert.Single(open);
        Assert.True(open[0] > 0.2, "1.3 V must hold the relay; 1.1 V releases it");
    }

    // Flyback diode (common practice): when the driver opens, the coil current freewheels through the
    // diode, which clamps the coil's low side at V_CC + V_D instead of a kilovolt kick, and lengthens the release: with an
    // ideal 0.6–0.7 V diode the current falls from 30 mA to the 3 mA drop-out current in
    // τ·ln((I0 + V_D/R)/(I_do + V_D/R)) = 2.38–2.43 ms, τ = L/R = 1.25 ms (R-L freewheel with a constant diode drop, solved by
    // hand).
    [Fact]
    public void Flyback_Diode_Clamps_The_Coil_And_Delays_Release()
    {
        SimulationResult r = BlockBench.Run(
        [
            BlockBench.Dc("VCC", "v", 12.0),
            new Relay("K1", "K1", "v", "low", [], s_class),
            new Switch("S1", "S1", "low", "gnd", 0.01, 1e8, initiallyClosed: true, [(0.1, 0.0)]),
            new Capacitor("CS", "CS", "low", "gnd", 100e-12),
            new Diode("D1", "D1", "low", "v", 7e-9, 1.8, seriesResistance: 0.035),
        ], 0.2, TransientOptions.Default with { RecordNodes = ["low", "K1.i"] });
        double pulled = Assert.Single(BlockBench.Times(r, "K1", "coil", "pulled in"));
        Assert.True(pulled < 0.1);
        double released = Assert.Single(BlockBench.Times(r, "K1", "coil", "released"));
        Assert.InRange(released - 0.1, 2.2e-3, 2.6e-3);
        Assert.InRange(r.Trace("low")!.Max, 12.3, 13.0);          // clamped one diode drop above the supply
        Assert.Equal(0.03, r.Trace("K1.i")!.At(0.099), 1e-4);      // 12 V / 400 Ω before opening
    }

    [Fact]
    public void Named_Load_Reports_Power_And_State()
    {
        Relay k = Make(load: "lamp");
        Assert.Equal("lamp", k.LoadName);
        Assert.Equal(60.0, k.LoadPower);
        Assert.False(k.LoadOn);
        ISwitchedLoad load = k;
        Assert.Equal("lamp", load.LoadName);
        Relay nc = new("K2", "K2", "c", "gnd", [], s_class with { LoadName = "lamp", LoadPower = 40, LoadNormallyClosed = true });
        Assert.True(nc.LoadOn);
    }

    private static Relay FromNetlist(Dictionary<string, double>? numbers = null, Dictionary<string, string>? texts = null) =>
        (Relay)Assert.Single(Relay.Kind.Create(BlockBench.Part("K1", "relay",
            new Dictionary<string, string> { ["coilA"] = "c", ["coilB"] = "gnd" }, numbers, texts)));

    // Pull-in and drop-out default to fractions of the rated coil voltage: typical 70 % and 20 % (common practice, from
    // memory: measured parts pull in at about 50–75 % of rated and drop out at 10–40 %); "worst" gives the class limits
    // must-operate 75 % and must-release 10 % (common practice: 9.0 V and 1.2 V for a 12 V coil).
    [Theory]
    [InlineData(null, null, 8.4, 2.4)]
    [InlineData(null, "worst", 9.0, 1.2)]
    [InlineData(24.0, "typical", 16.8, 4.8)]
    [InlineData(24.0, "worst", 18.0, 2.4)]
    [InlineData(5.0, null, 3.5, 1.0)]
    public void Thresholds_Default_To_Fractions_Of_The_Rated_Voltage(double? rated, string? thresholds, double pullIn, double dropOut)
    {
        var numbers = new Dictionary<string, double>();
        if (rated is double v) numbers["ratedVoltage"] = v;
        var texts = new Dictionary<string, string>();
        if (thresholds is string t) texts["thresholds"] = t;
        Relay k = FromNetlist(numbers, texts);
        Assert.Equal(pullIn, k.Settings.PullIn, 12);
        Assert.Equal(dropOut, k.Settings.DropOut, 12);
    }

    [Fact]
    public void Explicit_Thresholds_Override_The_Rated_Fractions()
    {
        Relay k = FromNetlist(new() { ["ratedVoltage"] = 24.0, ["pullIn"] = 9.0, ["dropOut"] = 1.2 }, new() { ["thresholds"] = "worst" });
        Assert.Equal(9.0, k.Settings.PullIn);
        Assert.Equal(1.2, k.Settings.DropOut);
        // Only one given: the other still follows the rated voltage (typical drop-out 20 % of 12 V = 2.4 V).
        Relay half = FromNetlist(new() { ["pullIn"] = 9.0 });
        Assert.Equal(2.4, half.Settings.DropOut, 12);
        // A drop-out above the pull-in it leads to is refused, naming both values.
        PartDefinition bad = BlockBench.Part("K1", "relay", new Dictionary<string, string> { ["coilA"] = "c", ["coilB"] = "gnd" },
            new() { ["pullIn"] = 2.0 });
        string problem = Assert.Single(Relay.Kind.Check!(bad));
        Assert.Contains("dropOut (2.4 V) must be below pullIn (2 V)", problem, StringComparison.Ordinal);
    }

    // Copper coil: R(T) = R20·(1 + 0.00393/K·(T − 20 °C)) (IEC 60028, International Standard of Resistance for Copper:
    // temperature coefficient of annealed copper 0.00393 per kelvin at 20 °C). 400 Ω at 70 °C: 478.6 Ω; at −20 °C: 337.12 Ω.
    [Theory]
    [InlineData(20.0, 400.0)]
    [InlineData(70.0, 478.6)]
    [InlineData(-20.0, 337.12)]
    public void Coil_Resistance_Follows_Copper_Temperature_Coefficient(double celsius, double ohms)
    {
        Relay k = FromNetlist(new() { ["coilTemperature"] = celsius });
        Assert.Equal(ohms, k.Settings.HotCoilResistance, 9);
        var h = new StampHarness("c");
        k.Setup(h);
        k.PowerUp();
        double[] x = [12.0, 0.02];
        LoadContext at = h.Load(k, x);
        Assert.Equal(12.0 - 400.0 * (1 + 0.00393 * (celsius - 20.0)) * 0.02, at.J[1], 12);   // branch: V_a − V_b − R(T)·i
        h.AssertJacobians(k, x);
        var role = Assert.IsType<RelayCoilRole>(k.Role);
        Assert.Equal(ohms, role.CoilResistance, 9);
        Assert.Equal(8.4 * ohms / 400.0, role.PullIn, 9);          // same pull-in current, more volts when hot
    }

    // A hot coil draws less current, so it pulls in later on a slow ramp: the pull-in current stays 9.0 V/400 Ω
    // = 22.5 mA (the ampere-turns the armature needs), reached at 22.5 mA·R(70 °C) = 10.7685 V, with the coil's own lag
    // τ = L/R(70 °C) (ramp response of an R-L, circuit theory).
    [Fact]
    public void Hot_Coil_Pulls_In_At_A_Higher_Voltage()
    {
        double hot = 400.0 * (1 + 0.00393 * 50.0);
        SimulationResult r = BlockBench.Run(
        [
            BlockBench.Pwl("VC", "c", (0, 0), (12, 12)),
            new Relay("K1", "K1", "c", "gnd", [], s_class with { CoilTemperature = 70.0 }),
        ], 12.0);
        double pulled = Assert.Single(BlockBench.Times(r, "K1", "coil", "pulled in"));
        Assert.Equal(9.0 / 400.0 * hot + 0.5 / hot, pulled, 1e-5);
    }
}

/// <summary>The relay's load and contact parameters as a netlist gives them, and the checks on them.</summary>
public sealed class RelayContactParameterTests
{
    private static NightSim.Netlist.NetlistLoadResult Read(string relayExtra) => NetlistLoader.ReadText($$"""
        { "name": "k", "parts": [
          { "id": "V1", "kind": "voltage-source", "nodes": ["vcc", "gnd"], "constant": "12V" },
          { "id": "K1", "kind": "relay", "pins": { "coilA": "vcc", "coilB": "gnd" } {{relayExtra}} }
        ] }
        """, "k.json");

    [Fact]
    public void Load_Kind_Voltage_And_Contact_Rating_Reach_The_Switched_Load_Role()
    {
        NightSim.Netlist.NetlistLoadResult r = Read(""", "load": "lamp", "loadPower": "60W", "loadKind": "incandescent", "loadVoltage": "120V", "loadPowerFactor": 0.95, "contactCurrent": "10A", "contactVoltage": "250V", "contactInrush": "80A", "contactLife": "100k" """);
        Assert.True(r.IsValid, string.Join("\n", r.Errors));
        ISwitchedLoad load = Relay.FromDefinition(r.Definition!.Part("K1")!);
        Assert.Equal(LoadKind.Incandescent, load.LoadKind);
        Assert.Equal(120.0, load.LoadVoltage);
        Assert.Equal(0.95, load.LoadPowerFactor);
        Assert.Equal(new ContactRating(10, 250, 1e5, 80), load.ContactRating);
    }

    [Fact]
    public void Unstated_Values_Take_The_Mains_Voltage_And_Leave_The_Rest_Unknown()
    {
        NightSim.Netlist.NetlistLoadResult r = Read(""", "load": "lamp", "loadPower": "60W" """);
        ISwitchedLoad load = Relay.FromDefinition(r.Definition!.Part("K1")!);
        Assert.Null(load.LoadKind);
        Assert.Equal(230.0, load.LoadVoltage); // IEC 60038 standard mains voltage
        Assert.Null(load.LoadPowerFactor);
        Assert.Equal(ContactRating.Unknown, load.ContactRating);
    }

    [Fact]
    public void Load_Words_Without_A_Named_Load_And_An_Inrush_Rating_Below_The_Steady_One_Are_Refused()
    {
        NightSim.Netlist.NetlistLoadResult r = Read(""", "loadKind": "incandescent", "contactCurrent": "10A", "contactInrush": "5A" """);
        Assert.False(r.IsValid);
        Assert.Contains(r.Errors, e => e.PartId == "K1" && e.Message.Contains("'loadKind' describes the named load", StringComparison.Ordinal));
        Assert.Contains(r.Errors, e => e.PartId == "K1" && e.Message.Contains("contactInrush (5 A) is below contactCurrent (10 A)", StringComparison.Ordinal));
        NightSim.Netlist.NetlistLoadResult unknown = Read(""", "load": "lamp", "loadPower": "60W", "loadKind": "halogen" """);
        Assert.False(unknown.IsValid);
        Assert.Contains(unknown.Errors, e => e.JsonPath == "$.parts[1].loadKind");
    }

    [Theory]
    [InlineData(230.0, true)]
    [InlineData(50.0, true)]
    [InlineData(24.0, false)] // extra-low voltage up to 50 V AC (IEC 60449 band I, from memory)
    public void A_Load_Faces_Mains_From_50_V(double volts, bool mains)
    {
        NightSim.Netlist.NetlistLoadResult r = Read($$""", "load": "lamp", "loadPower": "20W", "loadVoltage": {{volts.ToString(System.Globalization.CultureInfo.InvariantCulture)}} """);
        Assert.Equal(mains, Relay.Kind.FacesMains(r.Definition!.Part("K1")!));
    }
}
