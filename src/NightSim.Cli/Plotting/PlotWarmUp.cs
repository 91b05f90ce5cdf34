using NightSim.Reporting;

namespace NightSim.Cli.Plotting;

/// <summary>
/// Loads the plot font and readies the renderer on a spare core while the circuit is solved: finding the font, starting
/// the text shaper and compiling the drawing code cost a few hundred milliseconds that would otherwise come after the
/// solve, before the first plot. It draws one small throw-away plot with every panel kind into memory. Failures are
/// ignored: the real plots report their own problems.
/// </summary>
public static class PlotWarmUp
{
    private static readonly object s_lock = new();
    private static Task? s_task;

    /// <summary>Start the warm-up once per process (later calls return the same task).</summary>
    public static Task Start()
    {
        lock (s_lock)
        {
            return s_task ??= Task.Run(Run);
        }
    }

    private static void Run()
    {
        try
        {
            if (!PlotWriter.PngFontAvailable) return;
            double[] t = [0, 600, 1200, 1800, 2400, 3000, 3600];
            var data = new PlotData
            {
                Title = "warm-up",
                Origin = DateTimeOffset.UnixEpoch,
                From = 0,
                To = 3600,
                FileStem = "warm-up",
                Series =
                [
                    new PlotSeries("illuminance", "lx", PlotPanel.Light, t, [100, 30, 10, 3, 1, 0.3, 0.1]),
                    new PlotSeries("sensor (node s)", "V", PlotPanel.Voltages, t, [1, 2, 4, 6, 8, 9, 9.5]),
                    new PlotSeries("1/3 supply", "V", PlotPanel.Voltages, t, [4, 4, 4, 4, 4, 4, 4], Dashed: true),
                    new PlotSeries("lamp on", "", PlotPanel.States, t, [0, 0, 0, 1, 1, 1, 1]),
                ],
                Markers = [new PlotMarker(1800, "sunset"), new PlotMarker(2000, "false trigger", Emphasis: true)],
            };
            OxyPlot.PlotModel model = NightPlotBuilder.Build(data);
            PlotWriter.Png(model, 320, 240);
            PlotWriter.ToInlineSvg(model, "w-", includeTitle: false, 320, 240);
        }
        catch (Exception)
        {
            // Only a warm-up: whatever failed here fails again, and is reported, when the real plots are drawn.
        }
    }
}
