using System.Globalization;
using System.Text.Json;
using NightSim.Results;

namespace NightSim.Reporting;

/// <summary>
/// The report of a run that stopped early (a simulation failure or an interruption): <c>"partial": true</c>, how far
/// the run got, why it stopped (run time and clock time, the nodes that would not settle with their last values, the
/// parts on them) and what to try. Written through <see cref="AtomicFile"/>.
/// </summary>
public static class PartialReportWriter
{
    /// <summary>What a partial report says.</summary>
    /// <param name="Netlist">Netlist path as given.</param>
    /// <param name="Scenario">Scenario path, or null for a plain transient.</param>
    /// <param name="StopTime">Run time the run was meant to reach, seconds.</param>
    /// <param name="ReachedTime">Run time of the last accepted point, seconds.</param>
    /// <param name="ReachedClock">Clock time of <paramref name="ReachedTime"/>, or null without a scenario.</param>
    /// <param name="Failure">Why it stopped, or null for an interruption.</param>
    /// <param name="Statistics">Solver statistics so far.</param>
    public sealed record Content(string Netlist, string? Scenario, double StopTime, double ReachedTime, string? ReachedClock,
        SimulationFailure? Failure, SolverStatistics Statistics);

    /// <summary>Write <paramref name="content"/> to <paramref name="path"/> atomically.</summary>
    public static void Write(Content content, string path) => AtomicFile.Write(path, s => Write(content, s));

    /// <summary>Write <paramref name="content"/> as indented JSON to <paramref name="stream"/>.</summary>
    public static void Write(Content content, Stream stream)
    {
        using var w = new Utf8JsonWriter(stream, new JsonWriterOptions { Indented = true });
        w.WriteStartObject();
        w.WriteBoolean("partial", true);
        w.WriteString("stoppedBy", content.Failure is null ? "interruption" : "simulation failure");
        w.WriteString("netlist", content.Netlist);
        if (content.Scenario is not null) w.WriteString("scenario", content.Scenario);
        w.WriteNumber("stopSeconds", content.StopTime);
        w.WriteNumber("reachedSeconds", content.ReachedTime);
        w.WriteNumber("fractionDone", content.StopTime > 0 ? Math.Clamp(content.ReachedTime / content.StopTime, 0, 1) : 0);
        if (content.ReachedClock is not null) w.WriteString("reachedClock", content.ReachedClock);
        if (content.Failure is { } f)
        {
            w.WriteStartObject("failure");
            w.WriteNumber("runSeconds", f.Time);
            w.WriteString("reason", f.Reason);
            w.WriteStartArray("worstNodes");
            for (int i = 0; i < f.WorstNodes.Count; i++)
            {
                w.WriteStartObject();
                w.WriteString("name", f.WorstNodes[i]);
                double v = i < f.WorstValues.Count ? f.WorstValues[i] : double.NaN;
                if (double.IsFinite(v)) w.WriteNumber("value", v); else w.WriteNull("value");
                w.WriteString("unit", f.WorstNodes[i].EndsWith(".i", StringComparison.Ordinal) ? "A" : "V");
                w.WriteEndObject();
            }
            w.WriteEndArray();
            w.WriteStartArray("parts");
            foreach (string p in f.Parts) w.WriteStringValue(p);
            w.WriteEndArray();
            w.WriteString("hint", f.Hint);
            w.WriteString("message", f.ToString());
            w.WriteEndObject();
        }
        SolverStatistics s = content.Statistics;
        w.WriteStartObject("solver");
        w.WriteNumber("acceptedSteps", s.AcceptedSteps);
        w.WriteNumber("rejectedSteps", s.RejectedSteps);
        w.WriteNumber("newtonIterations", s.NewtonIterations);
        w.WriteNumber("continuations", s.Continuations);
        w.WriteNumber("cpuSeconds", Math.Round(s.CpuSeconds, 3));
        w.WriteEndObject();
        w.WriteString("note", string.Create(CultureInfo.InvariantCulture,
            $"partial result: the run stopped at {content.ReachedTime:0.###} s of {content.StopTime:0.###} s; trace-partial.csv holds what was computed"));
        w.WriteEndObject();
    }
}
