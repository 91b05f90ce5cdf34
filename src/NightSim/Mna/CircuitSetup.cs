using NightSim.Netlist;
using NightSim.Devices;
using NightSim.Sky;

namespace NightSim.Mna;

/// <summary>
/// The <see cref="SetupContext"/> the engine hands to devices: numbers nodes and branches, reserves matrix slots in
/// one <see cref="SparsityPattern"/>, resolves light channels through the run's light signal.
/// </summary>
internal sealed class CircuitSetup : SetupContext
{
    private readonly Dictionary<string, int> _nodes = new(StringComparer.Ordinal);
    private readonly ILightSignal? _light;

    public CircuitSetup(ILightSignal? light) => _light = light;

    public SparsityPattern Pattern { get; } = new();
    public List<string> Labels { get; } = [];
    public List<UnknownKind> Kinds { get; } = [];

    /// <summary>True for the names that mean ground.</summary>
    public static bool IsGround(string name) => Ground.Is(name);

    public override int Node(string name)
    {
        if (IsGround(name)) return -1;
        if (_nodes.TryGetValue(name, out int index)) return index;
        index = Add(name, UnknownKind.Node);
        _nodes.Add(name, index);
        return index;
    }

    public override int Branch(string label) => Add(label, UnknownKind.Branch);

    public override int InternalNode(string label) => Add(label, UnknownKind.InternalNode);

    public override int Slot(int row, int col) => Pattern.Reserve(row, col);

    public override int LightChannel(string name) => _light?.ChannelIndex(name) ?? -1;

    public override bool HasLightSignal => _light is not null;

    private int Add(string label, UnknownKind kind)
    {
        Labels.Add(label);
        Kinds.Add(kind);
        Pattern.Size = Labels.Count;
        return Labels.Count - 1;
    }
}
