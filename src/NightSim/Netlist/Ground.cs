namespace NightSim.Netlist;

/// <summary>The one definition of ground: the names a netlist may use for it and the name the engine uses after
/// loading. Every other place asks here.</summary>
public static class Ground
{
    /// <summary>Ground as the engine names it after loading (the loader normalises every ground spelling to it).</summary>
    public const string Node = "gnd";

    /// <summary>True for a ground name: "gnd" in any case (a bare "0" is accepted too, never shown).</summary>
    public static bool Is(string node) => node == "0" || node.Equals(Node, StringComparison.OrdinalIgnoreCase);

    /// <summary>The node name as the engine sees it: ground becomes <see cref="Node"/>, other names are trimmed.</summary>
    public static string Normalize(string node) => Is(node.Trim()) ? Node : node.Trim();
}
