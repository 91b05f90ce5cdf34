namespace NightSim.Netlist;

/// <summary>
/// Short parameter names of older netlists and the descriptive names that replaced them. Used only to word the hint of
/// an "unknown parameter" error; the old names are not accepted.
/// </summary>
public static class RetiredNames
{
    private static readonly Dictionary<string, string[]> s_successors = new(StringComparer.OrdinalIgnoreCase)
    {
        ["is"] = ["saturationCurrent"],
        ["n"] = ["emission"],
        ["rs"] = ["seriesResistance"],
        ["cjo"] = ["junctionCapacitance"],
        ["vj"] = ["junctionPotential"],
        ["m"] = ["junctionGrading"],
        ["tt"] = ["transitTime"],
        ["bv"] = ["breakdownVoltage"],
        ["ibv"] = ["breakdownCurrent"],
        ["bf"] = ["forwardGain"],
        ["br"] = ["reverseGain"],
        ["vaf"] = ["earlyVoltage"],
        ["cje"] = ["baseEmitterCapacitance"],
        ["cjc"] = ["baseCollectorCapacitance"],
        ["tf"] = ["forwardTransitTime"],
        ["tr"] = ["reverseTransitTime"],
        ["dc"] = ["constant"],
        ["pwl"] = ["points"],
        ["luxPwl"] = ["luxPoints"],
        ["v1"] = ["base"],
        ["v2"] = ["peak"],
        ["delay"] = ["start"],
        ["rise"] = ["riseTime"],
        ["fall"] = ["fallTime"],
        ["width"] = ["hold"],
        ["period"] = ["repeatEvery"],
    };

    /// <summary>The name among <paramref name="valid"/> that replaced the retired <paramref name="name"/>, or null.</summary>
    public static string? Successor(string name, IReadOnlyCollection<string> valid) =>
        s_successors.TryGetValue(name, out string[]? next) ? next.FirstOrDefault(valid.Contains) : null;
}
