using NightSim.Devices.Roles;
using NightSim.Results;
using NightSim.Netlist;

namespace NightSim.Devices.Composite;

/// <summary>
/// 555-class timer, expanded at load time into primitives with internal nodes "&lt;id&gt;.&lt;name&gt;":
/// an internal three-leg divider (vcc → control → &lt;id&gt;.lower → gnd, so the control pin sits at 2/3 of the supply
/// and the lower tap at half the control voltage), a threshold comparator (threshold against control), a trigger
/// comparator (trigger against half the control voltage), a reset comparator (reset pin against a fixed threshold),
/// a latch in which the reset pin dominates and the trigger overrides the threshold (textbook 555 logic: TRIG below 1/3
/// holds the output high whatever THRES does), a discharge switch with on-resistance, an output stage whose levels depend
/// on supply and load, input bias currents and a quiescent supply current rising with supply.
/// </summary>
/// <remarks>
/// Two families by <c>variant</c> (bipolar by default), input currents from the typical or the maximum column by
/// <c>inputCurrents</c>; every value can be overridden. Defaults are common practice for the part class
/// (typical bands of the bipolar and CMOS families), some from memory: see each parameter's description.
/// </remarks>
public static class Timer555
{
    // Bipolar by default: the family most builds use (common practice).
    private static readonly ParameterSpec s_variant = ParameterSpec.Word("variant", "Part family: sets the defaults below (bipolar: the family most builds use)", "bipolar", "cmos") with { DefaultText = "bipolar" };
    private static readonly ParameterSpec s_inputCurrents = ParameterSpec.Word("inputCurrents",
        "Which data-sheet column the threshold, trigger and reset currents take: typical, or maximum for a worst-case check", "typical", "maximum") with { DefaultText = "typical" };
    private static readonly ParameterSpec s_thresholdCurrent = Current("thresholdCurrent", "Current into the threshold pin (bipolar 0.1 µA typical, 0.25 µA maximum; CMOS 10 pA typical, 100 pA maximum; from memory)");
    private static readonly ParameterSpec s_triggerCurrent = Current("triggerCurrent", "Current out of the trigger pin (bipolar 0.5 µA typical, 0.9 µA maximum; CMOS 10 pA typical, 100 pA maximum; from memory)");
    private static readonly ParameterSpec s_resetCurrent = Current("resetCurrent", "Current out of the reset pin while it is held low (bipolar 0.1 mA typical, 0.4 mA maximum; CMOS 10 pA typical, 100 pA maximum; from memory)");
    private static readonly ParameterSpec s_resetThreshold = ParameterSpec.Number("resetThreshold", "V", "Reset pin threshold above gnd (0.7 V both families; from memory)") with { Min = 0, Max = 20 };
    private static readonly ParameterSpec s_dischargeResistance = ParameterSpec.Number("dischargeResistance", "Ω", "Discharge switch on-resistance (bipolar 10 Ω, CMOS 15 Ω; from memory)") with { Min = 1e-3, Max = 1e6 };
    private static readonly ParameterSpec s_dischargeOffResistance = ParameterSpec.Number("dischargeOffResistance", "Ω", "Discharge switch off-resistance, i.e. leakage (bipolar 500 MΩ ≈ 20 nA at 10 V, CMOS 10 GΩ; common practice)") with { Min = 1e3, Max = 1e18 };
    private static readonly ParameterSpec s_supplyCurrent = ParameterSpec.Number("supplyCurrent", "A", "Quiescent supply current at supplyNominal, divider included; proportional to supply (bipolar 8 mA, CMOS 0.2 mA at 15 V; common practice band 3–10 mA and 0.1–0.4 mA)") with { Min = 0, Max = 0.1 };
    private static readonly ParameterSpec s_supplyNominal = ParameterSpec.Number("supplyNominal", "V", "Supply voltage at which supplyCurrent is given") with { Default = 15.0, Min = 1, Max = 30 };
    private static readonly ParameterSpec s_dividerResistance = ParameterSpec.Number("dividerResistance", "Ω", "Each of the three internal divider legs (bipolar 5 kΩ, CMOS 100 kΩ; from memory)") with { Min = 1, Max = 1e9 };
    private static readonly ParameterSpec s_outputDropHigh = ParameterSpec.Number("outputDropHigh", "V", "High output level below vcc, unloaded (bipolar 1.4 V, CMOS 0 V; common practice)") with { Min = 0, Max = 5 };
    private static readonly ParameterSpec s_outputDropLow = ParameterSpec.Number("outputDropLow", "V", "Low output level above gnd, unloaded (bipolar 0.05 V, CMOS 0 V; from memory)") with { Min = 0, Max = 5 };
    private static readonly ParameterSpec s_outputResistanceHigh = ParameterSpec.Number("outputResistanceHigh", "Ω", "Output resistance when sourcing (bipolar 3 Ω, CMOS 150 Ω; from memory)") with { Min = 1e-3, Max = 1e6 };
    private static readonly ParameterSpec s_outputResistanceLow = ParameterSpec.Number("outputResistanceLow", "Ω", "Output resistance when sinking (bipolar 10 Ω, CMOS 20 Ω; from memory)") with { Min = 1e-3, Max = 1e6 };
    private static readonly ParameterSpec s_thresholdOffset = ParameterSpec.Number("thresholdOffset", "V", "Threshold comparator offset (threshold spread)") with { Default = 0.0, Min = -10, Max = 10 };
    private static readonly ParameterSpec s_triggerOffset = ParameterSpec.Number("triggerOffset", "V", "Trigger comparator offset: fires when trigger < control/2 − offset") with { Default = 0.0, Min = -10, Max = 10 };
    private static readonly ParameterSpec s_offsetTolerance = ParameterSpec.Number("offsetTolerance", "V", "Spread of the threshold and trigger comparator offsets between parts (±), for `nightsim spread` (from memory: divider mismatch and comparator offset, tens of millivolts).") with { Default = 0.05, Min = 0, Max = 5 };
    private static readonly ParameterSpec s_inputCurrentTolerance = ParameterSpec.Number("inputCurrentTolerance", "", "Relative spread of the threshold and trigger input currents between parts, for `nightsim spread`.") with { Default = 0.5, Min = 0, Max = 0.99 };
    private static readonly ParameterSpec s_hysteresis = ParameterSpec.Number("hysteresis", "V", "Hysteresis of the internal comparators") with { Default = 1e-3, Min = 0, Max = 1 };
    private static readonly ParameterSpec s_transition = ParameterSpec.Number("transition", "s", "Transition time of the internal comparators, latch and output") with { Default = 1e-6, Min = 1e-12, Max = 1e-3 };

    /// <summary>Defaults of one family.</summary>
    private sealed record Family(double ThresholdCurrent, double TriggerCurrent, double ResetCurrent, double ResetThreshold,
        double DischargeResistance, double DischargeOffResistance, double SupplyCurrent, double DividerResistance,
        double OutputDropHigh, double OutputDropLow, double OutputResistanceHigh, double OutputResistanceLow);

    // Common practice for the part class (discharge leakage, supply current, output drop); input currents (typical and
    // maximum columns), divider legs, reset values, discharge and output resistances from memory.
    private static readonly Family s_bipolar = new(0.1e-6, 0.5e-6, 0.1e-3, 0.7, 10.0, 500e6, 8e-3, 5e3, 1.4, 0.05, 3.0, 10.0);
    private static readonly Family s_bipolarMaximum = s_bipolar with { ThresholdCurrent = 0.25e-6, TriggerCurrent = 0.9e-6, ResetCurrent = 0.4e-3 };
    private static readonly Family s_cmos = new(10e-12, 10e-12, 10e-12, 0.7, 15.0, 10e9, 0.2e-3, 100e3, 0.0, 0.0, 150.0, 20.0);
    private static readonly Family s_cmosMaximum = s_cmos with { ThresholdCurrent = 100e-12, TriggerCurrent = 100e-12, ResetCurrent = 100e-12 };

    private static Family FamilyOf(PartParameters p)
    {
        bool maximum = p.TextOrDefault(s_inputCurrents) == "maximum";
        return p.TextOrDefault(s_variant) == "cmos" ? (maximum ? s_cmosMaximum : s_cmos) : (maximum ? s_bipolarMaximum : s_bipolar);
    }

    public static PartKind Kind { get; } = new()
    {
        Name = "timer-555",
        Description = "555-class timer (bipolar or CMOS) built from divider, comparators, latch, discharge switch and output stage",
        Pins = ["gnd", "trigger", "output", "reset", "control", "threshold", "discharge", "vcc"],
        OptionalPins = ["control"],
        Parameters =
        [
            s_variant, s_inputCurrents, s_thresholdCurrent, s_triggerCurrent, s_resetCurrent, s_resetThreshold, s_dischargeResistance,
            s_dischargeOffResistance, s_supplyCurrent, s_supplyNominal, s_dividerResistance, s_outputDropHigh, s_outputDropLow,
            s_outputResistanceHigh, s_outputResistanceLow, s_thresholdOffset, s_triggerOffset, s_hysteresis, s_transition,
            s_offsetTolerance, s_inputCurrentTolerance,
        ],
        Create = Expand,
    };

    /// <summary>The value a timer part actually uses for a numeric parameter (SI): the netlist's override, else the
    /// family default of its variant, else the spec default. For analysers (closed-form on-time, leakage margin).</summary>
    /// <exception cref="KeyNotFoundException">Not a numeric parameter of this kind.</exception>
    public static double EffectiveNumber(PartDefinition part, string name)
    {
        if (part.Parameters.OptionalNumber(name) is double given) return given;
        Family f = FamilyOf(part.Parameters);
        return name switch
        {
            "thresholdCurrent" => f.ThresholdCurrent,
            "triggerCurrent" => f.TriggerCurrent,
            "resetCurrent" => f.ResetCurrent,
            "resetThreshold" => f.ResetThreshold,
            "dischargeResistance" => f.DischargeResistance,
            "dischargeOffResistance" => f.DischargeOffResistance,
            "supplyCurrent" => f.SupplyCurrent,
            "dividerResistance" => f.DividerResistance,
            "outputDropHigh" => f.OutputDropHigh,
            "outputDropLow" => f.OutputDropLow,
            "outputResistanceHigh" => f.OutputResistanceHigh,
            "outputResistanceLow" => f.OutputResistanceLow,
            _ => Kind.Parameters.FirstOrDefault(s => s.Name == name)?.Default
                 ?? throw new KeyNotFoundException($"timer-555 has no numeric parameter '{name}'"),
        };
    }

    private static ParameterSpec Current(string name, string description) =>
        ParameterSpec.Number(name, "A", description) with { Min = 0, Max = 0.01 };

    /// <summary>Expands a timer part into its primitive devices.</summary>
    public static IEnumerable<Device> Expand(PartDefinition part)
    {
        PartParameters p = part.Parameters;
        Family family = FamilyOf(p);
        string id = part.Id;
        string Internal(string local) => id + "." + local;

        string vcc = part.Node("vcc"), gnd = part.Node("gnd"), trigger = part.Node("trigger"), threshold = part.Node("threshold");
        string discharge = part.Node("discharge"), output = part.Node("output"), reset = part.Node("reset");
        string control = part.Pins.TryGetValue("control", out string? c) ? c : Internal("control");
        string lower = Internal("lower");

        double hysteresis = p.NumberOrDefault(s_hysteresis);
        double transition = p.NumberOrDefault(s_transition);
        double divider = p.Number(s_dividerResistance.Name, family.DividerResistance);

        var devices = new List<Device>
        {
            new FixedConductance(Internal("divider-upper"), id, vcc, control, 1.0 / divider),
            new FixedConductance(Internal("divider-middle"), id, control, lower, 1.0 / divider),
            new FixedConductance(Internal("divider-lower"), id, lower, gnd, 1.0 / divider),
        };

        // Internal comparators drive only the latch inputs: 1 kΩ outputs, no load.
        var logic = new ComparatorSettings(Hysteresis: hysteresis, OutputResistance: 1e3, Transition: transition);
        devices.Add(new Comparator(Internal("threshold-comparator"), id, threshold, control, Internal("r"), vcc, gnd,
            logic with { Offset = p.NumberOrDefault(s_thresholdOffset), RisingMeans = DeviceEventKind.ThresholdReached, FallingMeans = DeviceEventKind.ThresholdLeft }));
        devices.Add(new Comparator(Internal("trigger-comparator"), id, lower, trigger, Internal("s"), vcc, gnd,
            logic with { Offset = p.NumberOrDefault(s_triggerOffset), RisingMeans = DeviceEventKind.TriggerFired, FallingMeans = DeviceEventKind.TriggerReleased }));
        // Reset comparator: high (clearing) while V(reset) − V(gnd) < resetThreshold; it powers up clearing because
        // every node starts at 0 V.
        devices.Add(new Comparator(Internal("reset-comparator"), id, gnd, reset, Internal("clear"), vcc, gnd,
            logic with { Offset = -p.Number(s_resetThreshold.Name, family.ResetThreshold), InitialHigh = true, RisingMeans = DeviceEventKind.ResetHeld, FallingMeans = DeviceEventKind.ResetReleased }));

        var latch = new SrLatch(Internal("latch"), id, Internal("s"), Internal("r"), Internal("clear"), Internal("q"), null, vcc, gnd,
            new SrLatchSettings(ResetDominant: false, OutputResistance: 1e3, Transition: transition, ClearActiveAtPowerUp: true,
                RisingMeans: DeviceEventKind.TimerOutputHigh, FallingMeans: DeviceEventKind.TimerOutputLow))
        {
            Role = new OneShotTimerRole(id, vcc, gnd, trigger, threshold, discharge, output,
                p.TextOrDefault(s_variant) == "bipolar" ? TimerFamily.Bipolar : TimerFamily.Cmos),
        };
        devices.Add(latch);

        devices.Add(new DischargeSwitch(Internal("discharge"), id, discharge, gnd, latch,
            p.Number(s_dischargeResistance.Name, family.DischargeResistance),
            p.Number(s_dischargeOffResistance.Name, family.DischargeOffResistance)));
        devices.Add(new OutputStage(Internal("output-stage"), id, output, vcc, gnd, latch,
            p.Number(s_outputDropLow.Name, family.OutputDropLow), p.Number(s_outputDropHigh.Name, family.OutputDropHigh),
            p.Number(s_outputResistanceLow.Name, family.OutputResistanceLow), p.Number(s_outputResistanceHigh.Name, family.OutputResistanceHigh)));

        AddBias(devices, Internal("threshold-current"), id, threshold, gnd, p.Number(s_thresholdCurrent.Name, family.ThresholdCurrent));
        AddBias(devices, Internal("trigger-current"), id, vcc, trigger, p.Number(s_triggerCurrent.Name, family.TriggerCurrent));
        AddBias(devices, Internal("reset-current"), id, vcc, reset, p.Number(s_resetCurrent.Name, family.ResetCurrent));

        // Quiescent current proportional to supply; the divider already draws V/(3 R_div) of it.
        double supplyCurrent = p.Number(s_supplyCurrent.Name, family.SupplyCurrent);
        double gSupply = supplyCurrent / p.NumberOrDefault(s_supplyNominal) - 1.0 / (3.0 * divider);
        if (gSupply > 0.0) devices.Add(new FixedConductance(Internal("supply"), id, vcc, gnd, gSupply));
        return devices;
    }

    private static void AddBias(List<Device> devices, string name, string id, string from, string to, double current)
    {
        if (current > 0.0) devices.Add(new BiasCurrent(name, id, from, to, current));
    }
}
