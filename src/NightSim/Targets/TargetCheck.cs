namespace NightSim.Targets;

/// <summary>One target checked on one night.</summary>
/// <param name="Target">Stable code: "switch-on-lux", "switch-on-after-sunset", "on-time", "off-by", "no-false-trigger",
/// "no-early-off", "no-chatter", "off-at-sunrise".</param>
/// <param name="Pass">True when the night met the target.</param>
/// <param name="Margin">How close it came, in <paramref name="Unit"/>: positive = inside the target by that much,
/// negative = outside by that much; null when there was nothing to measure (no switch-on).</param>
/// <param name="Unit">"lx", "min", "s" or "count".</param>
/// <param name="Detail">Plain words with the measured value and the limit.</param>
/// <param name="Scale">The target's own size in <paramref name="Unit"/>, for comparing margins of different targets.</param>
public sealed record TargetCheck(string Target, bool Pass, double? Margin, string Unit, string Detail, double Scale = 1.0)
{
    /// <summary>Margin divided by the target's scale (−1 for a miss with nothing measured; a passed count target counts as comfortable, 1).</summary>
    public double RelativeMargin => Unit == "count" && Pass ? 1.0 : Margin is double m ? m / Scale : Pass ? 0.0 : -1.0;
}

/// <summary>Every target checked on one night.</summary>
public sealed record NightTargets(DateOnly Date, IReadOnlyList<TargetCheck> Checks)
{
    /// <summary>True when every target passed.</summary>
    public bool Pass => Checks.All(c => c.Pass);

    /// <summary>Number of targets missed.</summary>
    public int Failed => Checks.Count(c => !c.Pass);
}
