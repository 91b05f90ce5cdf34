using NightSim.Netlist;

namespace NightSim.Devices;

/// <summary>
/// Netlist kind "zener": a <see cref="Diode"/> with reverse breakdown set from data-sheet style figures — Zener voltage
/// V_Z at test current I_ZT and dynamic resistance Z_ZT there: BV = V_Z, I_BV = I_ZT, N_bv = Z_ZT·I_ZT/V_T (the slope of
/// the exponential breakdown branch at I_ZT equals 1/Z_ZT).
/// </summary>
public static class Zener
{
    /// <summary>Netlist kind "zener": nodes [anode, cathode]; in regulation the cathode is positive.</summary>
    public static PartKind Kind { get; } = new()
    {
        Name = "zener",
        Description = "Zener diode: breakdown voltage at a test current with a dynamic resistance; nodes [anode, cathode].",
        Pins = ["anode", "cathode"],
        UsesNodeList = true,
        Parameters =
        [
            ParameterSpec.Number("vz", "V", "Zener voltage at the test current.") with { Required = true, Min = 1, Max = 400 },
            ParameterSpec.Number("izt", "A", "Test current.") with { Default = 5e-3, Min = 1e-6, Max = 5 },
            ParameterSpec.Number("zzt", "Ω", "Dynamic resistance at the test current.") with { Default = 10, Min = 0.01, Max = 1e4 },
            ParameterSpec.Number("saturationCurrent", "A", "Forward saturation current.") with { Default = 1e-14, Min = 1e-20, Max = 1e-3 },
            ParameterSpec.Number("emission", "", "Forward emission coefficient.") with { Default = 1.0, Min = 0.5, Max = 4 },
            ParameterSpec.Number("seriesResistance", "Ω", "Series resistance.") with { Default = 0, Min = 0, Max = 1e3 },
            ParameterSpec.Number("junctionCapacitance", "F", "Zero-bias junction capacitance.") with { Default = 0, Min = 0, Max = 1e-6 },
            ParameterSpec.Number("powerRating", "W", "Rated dissipation, e.g. \"1.3W\": `nightsim supply` compares the dissipation against it (absent = not judged).") with { Min = 1e-3, Max = 1e3 },
        ],
        Create = def => [Create(def.Id, def.Id, def.Node("anode"), def.Node("cathode"), def.Parameters.Number("vz"),
            def.Parameters.Number("izt", 5e-3), def.Parameters.Number("zzt", 10), def.Parameters.Number("saturationCurrent", 1e-14),
            def.Parameters.Number("emission", 1.0), def.Parameters.Number("seriesResistance", 0), def.Parameters.Number("junctionCapacitance", 0),
            powerRating: def.Parameters.OptionalNumber("powerRating"))],
        ConductsDc = true,
    };

    /// <summary>Builds the diode for a Zener with V_Z (V) at I_ZT (A) and dynamic resistance Z_ZT (Ω); its role states
    /// V_Z, I_ZT and the rated dissipation (W, null when not stated).</summary>
    public static Diode Create(string name, string partId, string anode, string cathode, double vz, double izt = 5e-3, double zzt = 10,
        double saturationCurrent = 1e-14, double emission = 1.0, double seriesResistance = 0, double junctionCapacitance = 0,
        double temperature = 300.15, double? powerRating = null)
    {
        double nbv = zzt * izt / Junction.ThermalVoltage(temperature);
        return new Diode(name, partId, anode, cathode, saturationCurrent, emission, seriesResistance, junctionCapacitance,
            breakdownVoltage: vz, breakdownCurrent: izt, breakdownEmission: nbv, temperature: temperature)
        {
            Role = new Roles.JunctionRole(partId, anode, cathode, vz) { TestCurrent = izt, PowerRating = powerRating },
        };
    }
}
