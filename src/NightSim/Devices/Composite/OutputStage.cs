using NightSim.Devices.Behavioural;

namespace NightSim.Devices.Composite;

/// <summary>
/// The timer's output stage: follows its latch (high while q is high) with levels that depend on the supply (a drop
/// below the upper rail and above the lower one) and on the load (separate high- and low-state output resistances),
/// as a Norton stage referenced to the supply pins (<see cref="SupplyOutput"/>).
/// </summary>
public sealed class OutputStage : Device
{
    private readonly ILogicLevel _latch;
    private readonly double _dropLow, _dropHigh, _gLow, _gHigh;
    private SupplyOutput _output;

    /// <param name="name">Device name.</param>
    /// <param name="partId">Netlist part id.</param>
    /// <param name="output">Output pin node.</param>
    /// <param name="vcc">Upper supply node.</param>
    /// <param name="gnd">Lower supply node.</param>
    /// <param name="latch">The latch it follows.</param>
    /// <param name="dropLow">Low level above gnd with no load, V.</param>
    /// <param name="dropHigh">High level below vcc with no load, V.</param>
    /// <param name="resistanceLow">Output resistance when low (sinking), Ω.</param>
    /// <param name="resistanceHigh">Output resistance when high (sourcing), Ω.</param>
    public OutputStage(string name, string partId, string output, string vcc, string gnd, ILogicLevel latch,
        double dropLow, double dropHigh, double resistanceLow, double resistanceHigh)
        : base(name, partId, [output, vcc, gnd])
    {
        _latch = latch;
        _dropLow = dropLow;
        _dropHigh = dropHigh;
        _gLow = 1.0 / resistanceLow;
        _gHigh = 1.0 / resistanceHigh;
    }

    public override void Setup(SetupContext setup) =>
        _output = SupplyOutput.Reserve(setup, setup.Node(Nodes[0]), setup.Node(Nodes[1]), setup.Node(Nodes[2]));

    public override void Load(LoadContext ctx) =>
        _output.Load(ctx, _latch.Level(ctx.Time), _gLow, _gHigh, _dropLow, _dropHigh);
}
