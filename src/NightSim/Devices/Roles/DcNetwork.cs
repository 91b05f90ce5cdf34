namespace NightSim.Devices.Roles;

/// <summary>Collects what <see cref="IDcElement"/> devices state about themselves. A drain is an element that only
/// takes charge away (leakage, input current): the analysis reports the network with and without the drains.</summary>
public abstract class DcNetwork
{
    /// <summary>A conductance <paramref name="siemens"/> between nodes <paramref name="a"/> and <paramref name="b"/>.</summary>
    public abstract void Conductance(string a, string b, double siemens, bool drain = false);

    /// <summary>A constant current <paramref name="amperes"/> leaving <paramref name="from"/> and entering <paramref name="to"/>.</summary>
    public abstract void Current(string from, string to, double amperes, bool drain = false);

    /// <summary>A capacitance between two nodes (open at DC; the timing capacitance of a one-shot).</summary>
    public abstract void Capacitance(string a, string b, double farads);
}
