using NightSim.Analysis;
using NightSim.Devices;
using NightSim.Results;
using NightSim.Runs;

namespace NightSim.Tests.Analysis;

/// <summary>
/// A relay's contacts against its lamp on hand-made runs (invented lamps, relays and times): the steady current from
/// the load's power, voltage and power factor, the switch-on peak from the kind's multiple, and the switch-ons counted
/// against the electrical life with the chatter apart.
/// </summary>
public sealed class ContactDutyTests
{
    private static readonly DateTimeOffset s_origin = new(2026, 11, 20, 12, 0, 0, TimeSpan.Zero);

    /// <summary>The contact facts of one relay as the night run builds them (the device's switched-load role).</summary>
    internal static ContactFacts Facts(double watts, LoadKind? kind, double volts = 230, double? powerFactor = null, ContactRating? rating = null) =>
        Assert.Single(ContactFactsBuilder.Build(
        [
            new Relay("K1", "K1", "vcc", "coil", [], new RelaySettings(LoadName: "lamp", LoadPower: watts, LoadKind: kind,
                LoadVoltage: volts, LoadPowerFactor: powerFactor, Contacts: rating)),
        ]));

    internal static RunFacts Run(int nights, IEnumerable<double> onTimes, IEnumerable<double> offTimes, ContactFacts contacts)
    {
        var events = onTimes.Select(t => new DiscreteEvent(t, "K1", "K1", "load lamp", "off", "on", DeviceEventKind.LoadOn))
            .Concat(offTimes.Select(t => new DiscreteEvent(t, "K1", "K1", "load lamp", "on", "off", DeviceEventKind.LoadOff)))
            .OrderBy(e => e.Time).ToList();
        return new RunFacts
        {
            Origin = s_origin,
            Duration = nights * 86400.0,
            Nights = [.. Enumerable.Range(0, nights).Select(k => new NightWindow(new DateOnly(2026, 11, 20).AddDays(k), k * 86400.0, (k + 1) * 86400.0, null, null, null, null))],
            DeviceEvents = events,
            Contacts = [contacts],
        };
    }

    [Fact]
    public void Steady_Current_Is_Power_Over_Voltage_For_A_Resistive_Load()
    {
        // P = V·I for a resistance on a sinusoidal supply (RMS values, power factor 1): 60 W / 230 V = 0.2609 A,
        // 100 W / 120 V = 0.8333 A.
        Assert.Equal(60.0 / 230.0, Facts(60, LoadKind.Resistive).SteadyCurrent, 12);
        Assert.Equal(0.8333, Facts(100, LoadKind.Incandescent, volts: 120).SteadyCurrent, 4);
        // A load of unstated kind is taken as power factor 1 and has no known switch-on peak.
        Assert.Equal(60.0 / 230.0, Facts(60, null).SteadyCurrent, 12);
        Assert.Null(Facts(60, null).PeakInrush);
    }

    [Fact]
    public void Steady_Current_Of_A_Driver_Or_Ballast_Divides_By_Its_Power_Factor()
    {
        // Real power P = V·I·cos φ (textbook AC power), so I = P/(V·cos φ): a 12 W driver at 0.9 on 230 V draws
        // 12/(230·0.9) = 57.97 mA; a 36 W ballast at 0.5 on 230 V 313.0 mA; a power factor stated on the part wins.
        Assert.Equal(0.05797, Facts(12, LoadKind.LedDriver).SteadyCurrent, 5);
        Assert.Equal(0.3130, Facts(36, LoadKind.Fluorescent).SteadyCurrent, 4);
        ContactFacts stated = Facts(12, LoadKind.LedDriver, powerFactor: 0.55);
        Assert.True(stated.PowerFactorStated);
        Assert.Equal(12 / (230 * 0.55), stated.SteadyCurrent, 12);
    }

    [Fact]
    public void Peak_Inrush_Is_The_Kinds_Upper_Multiple_Of_The_Steady_Current()
    {
        // Filament 15× (common practice, from memory): a 100 W lamp on 230 V, 0.4348 A steady, peaks at 6.522 A.
        ContactFacts lamp = Facts(100, LoadKind.Incandescent);
        Assert.Equal(15 * 100 / 230.0, lamp.PeakInrush!.Value, 9);
        // LED driver 100× (common practice, from memory) of 12/(230·0.9) A = 5.797 A.
        Assert.Equal(5.797, Facts(12, LoadKind.LedDriver).PeakInrush!.Value, 3);
        // A resistive load: no more than its steady current.
        Assert.Equal(60 / 230.0, Facts(60, LoadKind.Resistive).PeakInrush!.Value, 12);
    }

    [Fact]
    public void Life_Counts_Every_Switch_On_And_Sets_The_Chatter_Apart()
    {
        // Two nights, invented: night 1 a clean dusk switch-on (17:00, off 21:00); night 2 a chatter burst of 10
        // switch-ons 2 s apart from 17:00 (20 operations within a minute: a burst, six or more within a minute) and
        // then a clean switch-on at 17:30. Electrical life 100 000 operations, one operation = a switch-on and its
        // switch-off (common practice of relay data).
        double day = 86400, dusk = 5 * 3600; // origin is noon: 17:00 is 5 h in
        var on = new List<double> { dusk };
        var off = new List<double> { dusk + 4 * 3600 };
        for (int k = 0; k < 10; k++)
        {
            on.Add(day + dusk + 2 * k);
            off.Add(day + dusk + 2 * k + 1);
        }
        on.Add(day + dusk + 1800);
        off.Add(day + dusk + 1800 + 4 * 3600);
        ContactFacts contacts = Facts(12, LoadKind.LedDriver, rating: new ContactRating(10, 250, 100_000));
        ContactDuty d = ContactDuty.Of(contacts, Run(2, on, off, contacts));

        Assert.Equal(12, d.Operations);
        Assert.Equal(10, d.ChatterOperations);
        Assert.Equal(6.0, d.OperationsPerNight);           // 12 switch-ons over 2 nights
        Assert.Equal(5.0, d.ChatterPerNight);
        Assert.Equal(100_000 / 6.0, d.LifeNights!.Value, 9);
        Assert.Equal(100_000 / 6.0 / 365.2425, d.LifeYears!.Value, 9); // mean Gregorian year
        Assert.Equal(100_000 / 1.0 / 365.2425, d.LifeYearsWithoutChatter!.Value, 9);
        Assert.Equal(day + dusk, d.FirstChatter);
    }

    [Fact]
    public void Without_A_Stated_Life_Or_Nights_There_Is_No_Life_Figure()
    {
        ContactFacts noLife = Facts(12, LoadKind.LedDriver, rating: new ContactRating(10, 250));
        Assert.Null(ContactDuty.Of(noLife, Run(1, [5 * 3600.0], [9 * 3600.0], noLife)).LifeYears);
        ContactFacts withLife = Facts(12, LoadKind.LedDriver, rating: new ContactRating(10, 250, 1e5));
        RunFacts plain = Run(1, [1.0], [2.0], withLife) with { Nights = [] };
        ContactDuty d = ContactDuty.Of(withLife, plain);
        Assert.Equal(1, d.Operations);
        Assert.Null(d.OperationsPerNight);
        Assert.Null(d.LifeYears);
    }

    [Fact]
    public void Ratings_Decide_Within_Or_May_Weld()
    {
        // 60 W resistive on 230 V: 0.261 A against 10 A; 230 V against 250 V: within.
        ContactDuty ok = ContactDuty.Of(Facts(60, LoadKind.Resistive, rating: new ContactRating(10, 250)), Run(1, [], [], Facts(60, LoadKind.Resistive)));
        Assert.True(ok.SteadyWithinRating);
        Assert.True(ok.InrushWithinRating);
        Assert.True(ok.VoltageWithinRating);
        Assert.False(ok.MayWeld);
        // Nothing stated: nothing judged.
        ContactDuty unknown = ContactDuty.Of(Facts(60, LoadKind.Resistive), Run(1, [], [], Facts(60, LoadKind.Resistive)));
        Assert.Null(unknown.SteadyWithinRating);
        Assert.Null(unknown.InrushWithinRating);
        Assert.Null(unknown.VoltageWithinRating);
        Assert.False(unknown.MayWeld);
    }
}
