namespace NightSim.Devices.Behavioural;

/// <summary>A behavioural block whose discrete state is also readable as a continuous level 0…1 (including its output
/// transition), so a follower stage inside a composite can track it without an event of its own.</summary>
public interface ILogicLevel
{
    /// <summary>Level at run time <paramref name="time"/> (seconds): 0 = low, 1 = high, in between while switching.</summary>
    double Level(double time);
}
