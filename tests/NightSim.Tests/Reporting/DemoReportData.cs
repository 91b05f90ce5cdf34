using NightSim.Analysis;
using NightSim.Reporting;

namespace NightSim.Tests.Reporting;

/// <summary>
/// Invented demo data for the presentation tests: an imaginary site ("Hollow Lane allotments"), an imaginary
/// night light with a 4-hour timer, one false trigger by a car's headlights. None of it comes from a real run;
/// the curves only need the right shapes (dusk fall over decades of lux, a trigger dip, an RC ramp to 2/3 supply).
/// </summary>
internal static class DemoReportData
{
    /// <summary>Run origin: local noon of the first evening (fixed offset, no zone database needed).</summary>
    public static readonly DateTimeOffset Origin = new(2026, 11, 20, 12, 0, 0, TimeSpan.FromHours(1));

    public const double Supply = 12.0;          // V, invented
    public const double OnAt = 5 * 3600 + 12 * 60;                 // 17:12:00, run seconds
    public const double TimerSeconds = 4 * 3600;                   // 4 h on-time
    public const double HeadlightAt = 11 * 3600 + 41 * 60 + 7;     // 23:41:07
    public const double HeadlightSeconds = 4;

    public static DateTimeOffset At(double runSeconds) => ClockTime.At(Origin, null, runSeconds);

    /// <summary>Illuminance at the sensor, lux: 500 lx at 16:00 falling to 0.01 lx at night and back at dawn, plus a headlight.</summary>
    public static double Lux(double t)
    {
        double h = t / 3600 + 12; // clock hours (may exceed 24)
        double logLux;
        if (h < 16) logLux = Math.Log10(500);
        else if (h < 17.75) logLux = Math.Log10(500) + (h - 16) / 1.75 * (-2 - Math.Log10(500));
        else if (h < 31) logLux = -2;
        else if (h < 32) logLux = -2 + (h - 31) * (Math.Log10(500) + 2);
        else logLux = Math.Log10(500);
        double lux = Math.Pow(10, logLux);
        if (t >= HeadlightAt && t < HeadlightAt + HeadlightSeconds) lux += 40;
        return lux;
    }

    private static bool RelayOn(double t) =>
        (t >= OnAt && t < OnAt + TimerSeconds) || (t >= HeadlightAt && t < HeadlightAt + TimerSeconds);

    /// <summary>Sample times: every 20 s over 24 h, every 20 ms within 10 s of each switching instant.</summary>
    public static double[] Times()
    {
        var set = new SortedSet<double>();
        for (double t = 0; t <= 86400; t += 20) set.Add(t);
        foreach (double e in new[] { OnAt, OnAt + TimerSeconds, HeadlightAt, HeadlightAt + HeadlightSeconds, HeadlightAt + TimerSeconds })
            for (int k = -500; k <= 500; k++) set.Add(Math.Round(e + k * 0.02, 6));
        return [.. set];
    }

    private static double[] Map(double[] times, Func<double, double> f)
    {
        var v = new double[times.Length];
        for (int i = 0; i < times.Length; i++) v[i] = f(times[i]);
        return v;
    }

    /// <summary>Sensor node voltage, V: a light-dependent resistor (invented law R = 20 kΩ·(lux/10)^-0.75) over 47 kΩ.</summary>
    private static double Sensor(double t)
    {
        double r = 20e3 * Math.Pow(Math.Max(Lux(t), 1e-3) / 10, -0.75);
        return Supply * r / (r + 47e3);
    }

    /// <summary>Trigger pin, V: sits at 2/3 supply, dips to 1 V for 50 ms at each switch-on.</summary>
    private static double Trigger(double t)
    {
        foreach (double e in new[] { OnAt, HeadlightAt })
            if (t >= e && t < e + 0.05) return 1.0;
        return Supply * 2 / 3 + 0.4;
    }

    /// <summary>Timing capacitor, V: charges towards the supply, reaches 2/3 after the timer interval, then discharged.</summary>
    private static double Timing(double t)
    {
        double tau = TimerSeconds / Math.Log(3);
        foreach (double e in new[] { OnAt, HeadlightAt })
            if (t >= e && t < e + TimerSeconds) return Supply * (1 - Math.Exp(-(t - e) / tau));
        return 0;
    }

    public static PlotData NightPlot()
    {
        double[] t = Times();
        return new PlotData
        {
            Title = "Night of 2026-11-20 — demo night light (invented data)",
            Origin = Origin,
            From = 4 * 3600,   // 16:00
            To = 20 * 3600,    // 08:00 next morning
            FileStem = "night-2026-11-20",
            Series =
            [
                new PlotSeries("illuminance at sensor", "lx", PlotPanel.Light, t, Map(t, Lux)),
                new PlotSeries("sensor (node sens)", "V", PlotPanel.Voltages, t, Map(t, Sensor)),
                new PlotSeries("trigger pin (node trig)", "V", PlotPanel.Voltages, t, Map(t, Trigger)),
                new PlotSeries("timing capacitor (node tc)", "V", PlotPanel.Voltages, t, Map(t, Timing)),
                new PlotSeries("1/3 supply", "V", PlotPanel.Voltages, [0, 86400], [Supply / 3, Supply / 3], Dashed: true),
                new PlotSeries("2/3 supply", "V", PlotPanel.Voltages, [0, 86400], [Supply * 2 / 3, Supply * 2 / 3], Dashed: true),
                new PlotSeries("relay contact", "", PlotPanel.States, t, Map(t, x => RelayOn(x) ? 1 : 0)),
                new PlotSeries("load lamp", "", PlotPanel.States, t, Map(t, x => RelayOn(x) ? 1 : 0)),
            ],
            Markers =
            [
                new PlotMarker(4 * 3600 + 31 * 60, "sunset 16:31"),
                new PlotMarker(5 * 3600 + 6 * 60, "civil dusk 17:06"),
                new PlotMarker(HeadlightAt, "headlight 23:41", Emphasis: true),
                new PlotMarker(19 * 3600 + 20 * 60, "civil dawn 07:20"),
                new PlotMarker(19 * 3600 + 55 * 60, "sunrise 07:55"),
            ],
        };
    }

    public static PlotData ZoomPlot() => NightPlot() with
    {
        Title = "Switch-on by headlight, 23:41:07 (invented data)",
        From = HeadlightAt - 3,
        To = HeadlightAt + 7,
        FileStem = "zoom-01-headlight",
        Markers = [new PlotMarker(HeadlightAt, "headlight on", Emphasis: true), new PlotMarker(HeadlightAt + HeadlightSeconds, "headlight off")],
    };

    public static TraceTable Trace()
    {
        double[] t = Times();
        return new TraceTable(Origin, null, t,
            ["illuminance_lux", "sens_volts", "tc_volts", "load_on"],
            [Map(t, Lux), Map(t, Sensor), Map(t, Timing), Map(t, x => RelayOn(x) ? 1 : 0)]);
    }

    /// <summary>A 300 W filament lamp on a relay with 1 A contacts (they may weld), and a load of unstated kind with
    /// markup characters in its name on a relay without a contact rating.</summary>
    public static IReadOnlyList<ContactDuty> Contacts() =>
    [
        new ContactDuty
        {
            Facts = new ContactFacts("K1", "lamp", 300, 230)
            {
                Kind = "incandescent", KindTitle = "incandescent (filament) lamp", InrushLow = 10, InrushHigh = 15, InrushSeconds = 5e-3,
                InrushDuration = "a few milliseconds", InrushSource = "common practice, from memory",
                ContactCurrent = 1, ContactVoltage = 250, ContactLife = 1e5, InrushLimit = 3,
            },
            Operations = 2, Nights = 2, FirstSwitchOn = OnAt,
        },
        new ContactDuty { Facts = new ContactFacts("K2", "porch <light> & 'sign'", 40, 230), Operations = 2, Nights = 2 },
    ];

    public static NightReport Report() => new()
    {
        Tool = "nightsim 0.1.0",
        Netlist = "examples/demo-night-light.json",
        Scenario = "examples/hollow-lane-november.json",
        CircuitName = "Demo night light <4 h timer> & relay",
        SiteName = "Hollow Lane allotments",
        TimeZone = "Etc/GMT-1",
        Seed = 20261120,
        Nights =
        [
            new NightSummary
            {
                Date = new DateOnly(2026, 11, 20),
                Sunset = At(4 * 3600 + 31 * 60),
                CivilDusk = At(5 * 3600 + 6 * 60),
                CivilDawn = At(19 * 3600 + 20 * 60),
                Sunrise = At(19 * 3600 + 55 * 60),
                SwitchLevelCrossing = At(OnAt),
                SwitchLevelLux = 3.2,
                LoadOn =
                [
                    new LoadInterval(At(OnAt), At(OnAt + TimerSeconds), TimerSeconds, LoadCause.Dusk, true,
                        "daylight fell through 3.2 lx", "timer ran out"),
                    new LoadInterval(At(HeadlightAt), At(HeadlightAt + TimerSeconds), TimerSeconds, LoadCause.Headlight, false,
                        "headlight at 23:41:07, 40 lx at the sensor for 4 s", "timer ran out"),
                ],
                FalseTriggers = 1,
                RelayOperations = 4,
                LoadEnergyWh = 80.0,
            },
            new NightSummary
            {
                Date = new DateOnly(2026, 11, 21),
                Sunset = At(86400 + 4 * 3600 + 30 * 60),
                CivilDusk = At(86400 + 5 * 3600 + 5 * 60),
                Sunrise = At(86400 + 19 * 3600 + 56 * 60),
                SwitchLevelCrossing = At(86400 + OnAt - 60),
                SwitchLevelLux = 3.1,
                LoadOn =
                [
                    new LoadInterval(At(86400 + OnAt - 60), null, 3 * 3600 + 10, LoadCause.Dusk, true,
                        "daylight fell through 3.1 lx", "end of run"),
                ],
                RelayOperations = 1,
                LoadEnergyWh = 60.06,
            },
        ],
        Findings =
        [
            new Finding(Severity.Info, "dusk-switch-level", "Switches on at 3.2 lx, 66 min after sunset."),
            new Finding(Severity.Error, "false-trigger-headlight",
                "A car's headlights (40 lx for 4 s at 23:41:07) started a second 4 h on-time.",
                "Add a delay of a few seconds before the trigger (RC on the sensor node) or shade the sensor from the road.",
                At(HeadlightAt), "LDR1"),
            new Finding(Severity.Warning, "timer-tolerance", "On-time varies ±12 % with the timing capacitor's tolerance.",
                "Use a film capacitor for the timing capacitor.", null, "C3"),
        ],
        Events =
        [
            new ReportEvent("headlights", At(HeadlightAt), At(HeadlightAt + HeadlightSeconds), 40, "car turning into the lane, 40 lx at the sensor") { DrawnFromSeed = false },
            new ReportEvent("cloud", At(4 * 3600), At(4 * 3600 + 1800), 0.4, "cloud bank, light × 0.4 <dimmer> & 'grey'"),
        ],
        Contacts = Contacts(),
        Statistics = new ReportStatistics(184_220, 1_031, 402_118, 12, 1.84),
        Cautions = ReportText.MainsCautions,
        Parts = ReportPart.List(s_netlist),
        CircuitHash = ReportPart.Hash(s_netlist),
    };

    /// <summary>A real demo netlist for the parts table (its parts, not its results).</summary>
    private static readonly NightSim.Netlist.NetlistDefinition s_netlist =
        NightSim.Netlist.NetlistLoader.Read(Path.Combine(RepoPaths.Netlists, "garden-path.json")).Definition!;
}
