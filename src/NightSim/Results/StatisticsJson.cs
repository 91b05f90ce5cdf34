using System.Text.Json;

namespace NightSim.Results;

/// <summary>Writes <see cref="SolverStatistics"/> (and the run's outcome) as a small JSON object.</summary>
public static class StatisticsJson
{
    /// <summary>Write the statistics of <paramref name="result"/> to <paramref name="stream"/>.</summary>
    public static void Write(SimulationResult result, Stream stream)
    {
        SolverStatistics s = result.Statistics;
        using var w = new Utf8JsonWriter(stream, new JsonWriterOptions { Indented = true });
        w.WriteStartObject();
        w.WriteNumber("stopTimeSeconds", result.StopTime);
        w.WriteBoolean("succeeded", result.Succeeded);
        if (result.Failure is { } f) w.WriteString("failure", f.ToString());
        w.WriteNumber("acceptedSteps", s.AcceptedSteps);
        w.WriteNumber("rejectedSteps", s.RejectedSteps);
        w.WriteNumber("newtonFailures", s.NewtonFailures);
        w.WriteNumber("forcedSteps", s.ForcedSteps);
        w.WriteNumber("newtonIterations", s.NewtonIterations);
        w.WriteNumber("factorizations", s.Factorizations);
        w.WriteNumber("pivotAnalyses", s.PivotAnalyses);
        w.WriteNumber("breakpoints", s.Breakpoints);
        w.WriteNumber("events", s.Events);
        w.WriteNumber("minStepSeconds", s.MinStep);
        w.WriteNumber("maxStepSeconds", s.MaxStep);
        w.WriteNumber("cpuSeconds", s.CpuSeconds);
        w.WriteEndObject();
    }
}
