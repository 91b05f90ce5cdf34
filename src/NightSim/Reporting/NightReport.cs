using NightSim.Analysis;

namespace NightSim.Reporting;

/// <summary>One interval with the load energised.</summary>
/// <param name="Start">Clock time it switched on (site local time with offset).</param>
/// <param name="End">Clock time it switched off; null when still on at the end of the run.</param>
/// <param name="DurationSeconds">On-time in seconds (to the end of the run when <paramref name="End"/> is null).</param>
/// <param name="Cause">What switched it on.</param>
/// <param name="Expected">True for the one intended dusk switch-on of the night.</param>
/// <param name="Explanation">The cause in plain words, e.g. "headlight at 23:41:07, 40 lx at the sensor for 4 s".</param>
/// <param name="EndedBy">What ended it in plain words ("timer ran out", "reset by daylight", "supply sag", "end of run").</param>
public sealed record LoadInterval(
    DateTimeOffset Start,
    DateTimeOffset? End,
    double DurationSeconds,
    LoadCause Cause,
    bool Expected,
    string Explanation,
    string EndedBy)
{
    /// <summary>0 for a real interval; for a table row that stands for several folded intervals, how many (its
    /// start is the first one's, its end the last one's, its duration their total on-time).</summary>
    public int Folded { get; init; }
}

/// <summary>What happened in one night (local noon to local noon).</summary>
public sealed record NightSummary
{
    /// <summary>Calendar date of the evening.</summary>
    public required DateOnly Date { get; init; }
    public DateTimeOffset? Sunset { get; init; }
    public DateTimeOffset? CivilDusk { get; init; }
    public DateTimeOffset? CivilDawn { get; init; }
    public DateTimeOffset? Sunrise { get; init; }

    /// <summary>Clock time the sensor's light fell through the circuit's effective switching level, or null.</summary>
    public DateTimeOffset? SwitchLevelCrossing { get; init; }

    /// <summary>The circuit's effective switching level at the sensor, lux (measured at the dusk switch-on), or null.</summary>
    public double? SwitchLevelLux { get; init; }

    public IReadOnlyList<LoadInterval> LoadOn { get; init; } = [];

    /// <summary>Switch-ons not caused by dusk.</summary>
    public int FalseTriggers { get; init; }

    /// <summary>On-times cut short (reset by a light event, supply sag) before the timer ran out.</summary>
    public int EarlyOffs { get; init; }

    /// <summary>Bursts of many relay operations within seconds.</summary>
    public int ChatterBursts { get; init; }

    /// <summary>Relay contact transitions (closing and opening each count one).</summary>
    public int RelayOperations { get; init; }

    /// <summary>It got dark but the load never came on.</summary>
    public bool Missed { get; init; }

    /// <summary>The load was still on at sunrise.</summary>
    public bool OnAfterSunrise { get; init; }

    /// <summary>Energy delivered to the named loads, watt-hours.</summary>
    public double LoadEnergyWh { get; init; }
}

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

    /// <summary>Mains cautions, printed whenever the design touches mains.</summary>
    public IReadOnlyList<string> Cautions { get; init; } = [];
}
