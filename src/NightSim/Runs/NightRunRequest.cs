using NightSim.Netlist;
using NightSim.Sky;
using NightSim.Transient;

namespace NightSim.Runs;

/// <summary>What to run: a netlist through a light scenario (a night run), or through a constant light for a fixed
/// time (a plain transient). Immutable.</summary>
public sealed record NightRunRequest
{
    /// <summary>The validated netlist.</summary>
    public required NetlistDefinition Netlist { get; init; }

    /// <summary>Netlist path as the user wrote it (for the report).</summary>
    public string NetlistPath { get; init; } = "";

    /// <summary>The light scenario, or null for a plain transient under <see cref="ConstantLux"/>.</summary>
    public LightScenario? Scenario { get; init; }

    /// <summary>Scenario path as the user wrote it (for the report), or null.</summary>
    public string? ScenarioPath { get; init; }

    /// <summary>Run length without a scenario, seconds (default 24 h). With a scenario the nights set it.</summary>
    public double? Duration { get; init; }

    /// <summary>Illuminance at every sensor without a scenario, lux.</summary>
    public double ConstantLux { get; init; }

    /// <summary>Solver options; the run sets its own trace list and light.</summary>
    public TransientOptions Options { get; init; } = TransientOptions.Default;

    /// <summary>Tool name and version for the report.</summary>
    public string Tool { get; init; } = "nightsim";

    /// <summary>A study's run: the report and the analysis only, no trace table, plot data or zoom windows (the result's
    /// <see cref="NightRunResult.Traces"/> and <see cref="NightRunResult.Plots"/> are then empty).</summary>
    public bool SummaryOnly { get; init; }

    /// <summary>Trace storage reused from the previous run on this thread (studies); the result's traces are valid only
    /// until the next run with the same buffers starts.</summary>
    public Results.TraceBuffers? TraceBuffers { get; init; }

    /// <summary>Stops the run at its next step (Ctrl+C, SIGTERM); the result is then marked interrupted.</summary>
    public CancellationToken Cancellation { get; init; }
}
