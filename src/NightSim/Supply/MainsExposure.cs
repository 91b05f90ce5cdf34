using NightSim.Devices;
using NightSim.Netlist;

namespace NightSim.Supply;

/// <summary>How a design meets the mains, for its cautions.</summary>
public enum MainsExposureKind
{
    /// <summary>No source of 50 V or more and no mains load (a switched load on less than 50 V, such as a 12 V or
    /// 24 V garden lamp, is not one).</summary>
    None,

    /// <summary>A low-voltage circuit whose relay switches a mains load (a named load on 50 V or more): the contacts and
    /// the lamp wiring carry mains.</summary>
    SwitchesMainsLoad,

    /// <summary>A source of 50 V or more (a mains sine, a high DC or piecewise rail): the circuit itself is not isolated.</summary>
    NotIsolated,
}

/// <summary>
/// Decides from the devices (their roles, not their kind names) whether a design is fed from a voltage of 50 V or more
/// or only switches a mains load, and gives the matching cautions. 50 V is the usual upper bound of extra-low voltage
/// (voltage band I of IEC 60449: up to 50 V AC, 120 V ripple-free DC; from memory — the lower AC figure is used for
/// every waveform).
/// </summary>
public static class MainsExposure
{
    /// <summary>Sources reaching this magnitude or more make the circuit itself hazardous, volts.</summary>
    public const double HazardousVoltage = PartKind.MainsVoltage;

    /// <summary>How <paramref name="devices"/> meet the mains.</summary>
    public static MainsExposureKind Classify(IEnumerable<Device> devices)
    {
        bool switchesLoad = false;
        foreach (Device d in devices)
        {
            if (d is VoltageSource v && v.Waveform.PeakMagnitude >= HazardousVoltage) return MainsExposureKind.NotIsolated;
            if (d is ISwitchedLoad { LoadName: not null } load && load.LoadVoltage >= HazardousVoltage) switchesLoad = true;
        }
        return switchesLoad ? MainsExposureKind.SwitchesMainsLoad : MainsExposureKind.None;
    }

    /// <summary>How a validated netlist meets the mains (its parts are created through the part catalogue).</summary>
    public static MainsExposureKind Classify(NetlistDefinition netlist) =>
        Classify(netlist.Parts.SelectMany(p => PartCatalog.Find(p.Kind)?.Create(p) ?? []));

    /// <summary>The cautions of a validated netlist.</summary>
    public static IReadOnlyList<string> Cautions(NetlistDefinition netlist) => Cautions(Classify(netlist));

    /// <summary>The cautions for <paramref name="kind"/> (empty for <see cref="MainsExposureKind.None"/>).</summary>
    public static IReadOnlyList<string> Cautions(MainsExposureKind kind) => kind switch
    {
        MainsExposureKind.NotIsolated => Reporting.ReportText.MainsCautions,
        MainsExposureKind.SwitchesMainsLoad => Reporting.ReportText.ContactCautions,
        _ => [],
    };
}
