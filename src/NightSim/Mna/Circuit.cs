using NightSim.Devices;
using NightSim.Netlist;
using NightSim.Sky;

namespace NightSim.Mna;

/// <summary>
/// A circuit ready for one run: its devices after <see cref="Device.Setup"/>, the unknown map (node voltages, internal
/// nodes, branch currents) and the fixed sparsity pattern. Devices hold per-run state, so build one circuit per run.
/// </summary>
public sealed class Circuit
{
    private readonly Dictionary<string, int> _unknownByLabel;

    private Circuit(string name, IReadOnlyList<Device> devices, CircuitSetup setup, ILightSignal? light)
    {
        Name = name;
        Devices = devices;
        Pattern = setup.Pattern;
        Labels = setup.Labels;
        Kinds = setup.Kinds;
        Light = light;
        EventSources = devices.OfType<IEventSource>().ToList();
        _unknownByLabel = new Dictionary<string, int>(StringComparer.Ordinal);
        for (int i = 0; i < Labels.Count; i++) _unknownByLabel.TryAdd(Labels[i], i);
        NodeDiagonal = new int[Labels.Count];
        for (int i = 0; i < Labels.Count; i++) NodeDiagonal[i] = Kinds[i] == UnknownKind.Branch ? -1 : Pattern.Reserve(i, i);
    }

    /// <summary>Circuit name.</summary>
    public string Name { get; }

    /// <summary>Devices in netlist order (composites expanded).</summary>
    public IReadOnlyList<Device> Devices { get; }

    /// <summary>Devices that have discrete state switched by events.</summary>
    public IReadOnlyList<IEventSource> EventSources { get; }

    /// <summary>Fixed sparsity pattern of the MNA matrix.</summary>
    public SparsityPattern Pattern { get; }

    /// <summary>Number of unknowns.</summary>
    public int Size => Labels.Count;

    /// <summary>Label of each unknown: node name, "R1.int" for internal nodes, "V1.i" for branch currents.</summary>
    public IReadOnlyList<string> Labels { get; }

    /// <summary>Kind of each unknown.</summary>
    public IReadOnlyList<UnknownKind> Kinds { get; }

    /// <summary>The light signal the circuit's sensors were resolved against (may be null).</summary>
    public ILightSignal? Light { get; }

    /// <summary>Diagonal slot of each voltage unknown (-1 for branch currents), used for gmin shunts.</summary>
    internal int[] NodeDiagonal { get; }

    /// <summary>Unknown index of a node or branch label, or -1 (ground or unknown name).</summary>
    public int IndexOf(string label) => _unknownByLabel.GetValueOrDefault(label, -1);

    /// <summary>Builds a circuit from engine devices (tests, composites, tools).</summary>
    public static Circuit FromDevices(string name, IEnumerable<Device> devices, ILightSignal? light = null)
    {
        var list = devices.ToList();
        var names = new HashSet<string>(StringComparer.Ordinal);
        foreach (Device d in list)
            if (!names.Add(d.Name)) throw new ArgumentException($"two devices are named '{d.Name}'", nameof(devices));
        var setup = new CircuitSetup(light);
        foreach (Device d in list) d.Setup(setup);
        return new Circuit(name, list, setup, light);
    }

    /// <summary>Builds a circuit from a validated netlist through the part catalogue.</summary>
    /// <exception cref="ArgumentException">A part kind is not registered.</exception>
    public static Circuit Build(NetlistDefinition netlist, ILightSignal? light = null)
    {
        var devices = new List<Device>();
        foreach (PartDefinition part in netlist.Parts)
        {
            PartKind kind = PartCatalog.Find(part.Kind)
                ?? throw new ArgumentException($"part '{part.Id}': unknown kind '{part.Kind}'", nameof(netlist));
            devices.AddRange(kind.Create(part));
        }
        return FromDevices(netlist.Name, devices, light);
    }
}
