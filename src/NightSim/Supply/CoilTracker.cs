using NightSim.Devices.Roles;

namespace NightSim.Supply;

/// <summary>Follows each relay coil's armature state from its coil voltage (coil current times coil resistance) with
/// the relay's own hysteresis: pulled in from the pull-in voltage, released at the drop-out voltage, as the relay
/// itself decides. Allocation-free per sample.</summary>
public sealed class CoilTracker
{
    private readonly double[] _pullIn, _dropOut;
    private readonly bool[] _on;

    public CoilTracker(IReadOnlyList<RelayCoilRole> relays)
    {
        _pullIn = [.. relays.Select(r => r.PullIn)];
        _dropOut = [.. relays.Select(r => r.DropOut)];
        _on = new bool[relays.Count];
    }

    /// <summary>True while relay <paramref name="k"/> is pulled in.</summary>
    public bool IsOn(int k) => _on[k];

    /// <summary>True while any relay is pulled in.</summary>
    public bool AnyOn
    {
        get
        {
            foreach (bool on in _on)
                if (on) return true;
            return false;
        }
    }

    /// <summary>Updates relay <paramref name="k"/> from its coil voltage; true when its state changed.</summary>
    public bool Update(int k, double coilVoltage)
    {
        bool next = _on[k] ? coilVoltage > _dropOut[k] : coilVoltage >= _pullIn[k];
        if (next == _on[k]) return false;
        _on[k] = next;
        return true;
    }
}
