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

    /// <summary>True for a name that is probably a misspelt ground: one edit or a swap from "gnd" ("gdn", "gn",
    /// "gnd1"), "ground"/"earth", or a short name starting with 0 ("0x", "00").</summary>
    public static bool LooksLike(string node)
    {
        string n = node.Trim().ToLowerInvariant();
        if (Is(n)) return false;
        if (n is "ground" or "earth" or "gnd_" or "agnd" or "dgnd") return true;
        if (n.Length <= 3 && n.StartsWith('0')) return true;
        // One edit from "gnd" ("gn", "gndd", "gnd1") or its letters swapped ("gdn", "ngd"); not "in" or "en".
        return n.Length is >= 2 and <= 4
            && (NearestName.Distance(n, Node) <= 1 || string.Concat(n.Order()) == string.Concat(Node.Order()));
    }
}
