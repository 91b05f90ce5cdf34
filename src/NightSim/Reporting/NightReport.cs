using NightSim.Analysis;

namespace NightSim.Reporting;

/// <summary>One concrete light or noise event of the run, as scheduled before the solve.</summary>
/// <param name="Kind">Event kind ("headlights", "lightning", "steady-light", "cloud", "noise", …).</param>
/// <param name="Start">Clock time it starts.</param>
/// <param name="End">Clock time it ends.</param>
/// <param name="Peak">Peak illuminance (lux) or amplitude (V or A, see <paramref name="Description"/>).</param>
/// <param name="Description">Plain words.</param>
public sealed record ReportEvent(string Kind, DateTimeOffset Start, DateTimeOffset End, double Peak, string Description)
{
    /// <summary>True when its time was drawn from the seed (a rate, a storm); false when the scenario gave it.</summary>
    public bool DrawnFromSeed { get; init; } = true;
}

/// <summary>How the solver did.</summary>
public sealed record ReportStatistics(long AcceptedSteps, long RejectedSteps, long NewtonIterations, long Events, double CpuSeconds);

/// <summary>Everything a night run reports: the document behind report.json, the page, the terminal table.</summary>
public sealed record NightReport
{
    public required string Tool { get; init; }
    public required string Netlist { get; init; }
    public string? Scenario { get; init; }
    public required string CircuitName { get; init; }
    public string? SiteName { get; init; }
    public string? TimeZone { get; init; }
    public ulong Seed { get; init; }
    public IReadOnlyList<NightSummary> Nights { get; init; } = [];
    public IReadOnlyList<Finding> Findings { get; init; } = [];
    public IReadOnlyList<ReportEvent> Events { get; init; } = [];
    public required ReportStatistics Statistics { get; init; }

    /// <summary>The parts as simulated (defaults applied), in netlist order.</summary>
    public IReadOnlyList<ReportPart> Parts { get; init; } = [];

    /// <summary>SHA-256 (hex) of the parts as simulated: equal hashes mean the same circuit, whatever the comments or layout.</summary>
    public string CircuitHash { get; init; } = "";

    /// <summary>What the design must do (from the scenario), or null when none is stated.</summary>
    public Sky.DesignTargets? Targets { get; init; }

    /// <summary>The target checks of each night, in the order of <see cref="Nights"/> (empty without targets).</summary>
    public IReadOnlyList<Targets.NightTargets> TargetResults { get; init; } = [];

    /// <summary>The summary across nights (pass rate, earliest and latest switch-on, on-time range, worst night).</summary>
    public Targets.NightsOverview Overview { get; init; } = new();

    /// <summary>Each relay's contacts against the load it switches (current, inrush, voltage, electrical life).</summary>
    public IReadOnlyList<ContactDuty> Contacts { get; init; } = [];

    /// <summary>Mains cautions, printed whenever the design touches mains.</summary>
    public IReadOnlyList<string> Cautions { get; init; } = [];
}
