using System.Text.Json;

namespace NightSim.Studies;

/// <summary>The bench report as JSON: <c>calibrationCpuSeconds</c> and <c>workloads[]</c>, one object per workload
/// with camelCase keys (<c>name</c>, <c>wallSeconds</c>, <c>cpuSeconds</c>, <c>solverCpuSeconds</c>,
/// <c>acceptedSteps</c>, <c>newtonIterations</c>, <c>allocatedBytesPerStep</c>, <c>error</c>,
/// <c>calibrationRatio</c>, …). Non-finite numbers are written as null.</summary>
public static class BenchJson
{
    public static string Write(BenchReport report)
    {
        using var stream = new MemoryStream();
        using (var w = new Utf8JsonWriter(stream, new JsonWriterOptions { Indented = true }))
        {
            w.WriteStartObject();
            w.WriteBoolean("quick", report.Quick);
            Number(w, "calibrationCpuSeconds", report.CalibrationCpuSeconds);
            w.WriteStartArray("workloads");
            foreach (BenchMeasurement m in report.Workloads)
            {
                w.WriteStartObject();
                w.WriteString("name", m.Name);
                w.WriteString("description", m.Description);
                Number(w, "simulatedSeconds", m.SimulatedSeconds);
                Number(w, "wallSeconds", m.WallSeconds);
                Number(w, "cpuSeconds", m.CpuSeconds);
                Number(w, "solverCpuSeconds", m.SolverCpuSeconds);
                w.WriteNumber("acceptedSteps", m.AcceptedSteps);
                w.WriteNumber("rejectedSteps", m.RejectedSteps);
                w.WriteNumber("newtonIterations", m.NewtonIterations);
                w.WriteNumber("factorizations", m.Factorizations);
                w.WriteNumber("events", m.Events);
                Number(w, "allocatedBytesPerStep", m.AllocatedBytesPerStep);
                Number(w, "error", m.Error);
                Number(w, "calibrationRatio", m.CalibrationRatio);
                w.WriteNumber("repetitions", m.Repetitions);
                w.WriteEndObject();
            }
            w.WriteEndArray();
            w.WriteEndObject();
        }
        return System.Text.Encoding.UTF8.GetString(stream.ToArray());
    }

    private static void Number(Utf8JsonWriter w, string name, double? value)
    {
        if (value is double v && double.IsFinite(v)) w.WriteNumber(name, v);
        else w.WriteNull(name);
    }
}
