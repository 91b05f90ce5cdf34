namespace NightSim.Devices.Roles;

/// <summary>A two-terminal device that can state the current through it at a solution, for measurements that the
/// analysis makes while a run steps (a Zener's regulation current, a rectifier's output current). Allocation-free.</summary>
public interface ITerminalCurrent
{
    /// <summary>Current entering the first terminal and leaving the second (a → b, anode → cathode), A, at the
    /// solution <paramref name="x"/> (node voltages and branch currents in unknown order; valid after Setup).</summary>
    double TerminalCurrent(ReadOnlySpan<double> x);
}
