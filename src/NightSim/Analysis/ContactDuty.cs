using NightSim.Results;

namespace NightSim.Analysis;

/// <summary>
/// One relay's contacts against its load over a run: the steady and switch-on current against the contact rating, the
/// voltage against the contact voltage, and the switch-ons counted against the electrical life, with those inside
/// chatter bursts counted apart. An operation of the electrical life is one switch-on and its switch-off (how contact
/// life is usually stated; common practice), so the run's operations are its switch-ons of the load.
/// </summary>
public sealed record ContactDuty
{
    /// <summary>A usual service life asked of a fixed outdoor lighting control, years (our assumption, stated in every
    /// finding that uses it).</summary>
    public const double ServiceYears = 10.0;

    /// <summary>Days in a mean calendar year (Gregorian calendar): one night per day.</summary>
    public const double NightsPerYear = 365.2425;

    public required ContactFacts Facts { get; init; }

    /// <summary>Switch-ons of the load in the run (each one operation of the electrical life).</summary>
    public int Operations { get; init; }

    /// <summary>Of those, switch-ons inside chatter bursts.</summary>
    public int ChatterOperations { get; init; }

    /// <summary>Nights the run covers (0 for a plain transient without a scenario).</summary>
    public int Nights { get; init; }

    /// <summary>Run time of the first switch-on, seconds, or null.</summary>
    public double? FirstSwitchOn { get; init; }

    /// <summary>Run time the first chatter burst starts, seconds, or null.</summary>
    public double? FirstChatter { get; init; }

    /// <summary>Switch-ons per night, or null without nights.</summary>
    public double? OperationsPerNight => Nights > 0 ? (double)Operations / Nights : null;

    /// <summary>Switch-ons in chatter per night, or null without nights.</summary>
    public double? ChatterPerNight => Nights > 0 ? (double)ChatterOperations / Nights : null;

    /// <summary>Nights the electrical life lasts at this run's rate, or null (no life stated, no nights or no
    /// switch-on).</summary>
    public double? LifeNights => LifeAt(OperationsPerNight);

    /// <summary><see cref="LifeNights"/> in years.</summary>
    public double? LifeYears => LifeNights / NightsPerYear;

    /// <summary>Years the life would last without the chatter switch-ons, or null.</summary>
    public double? LifeYearsWithoutChatter => LifeAt(OperationsPerNight - ChatterPerNight) / NightsPerYear;

    /// <summary>Steady current within the resistive contact rating (null: no rating stated).</summary>
    public bool? SteadyWithinRating => Facts.ContactCurrent is double rated ? Facts.SteadyCurrent <= rated : null;

    /// <summary>Typical switch-on peak within what the contacts take (null: no rating or no load kind stated).</summary>
    public bool? InrushWithinRating => Facts.InrushLimit is double limit && Facts.PeakInrush is double peak ? peak <= limit : null;

    /// <summary>Load voltage within the contact voltage (null: not stated).</summary>
    public bool? VoltageWithinRating => Facts.ContactVoltage is double rated ? Facts.Voltage <= rated : null;

    /// <summary>The contacts may weld: the steady current above their rating, or the switch-on peak above what they take.</summary>
    public bool MayWeld => SteadyWithinRating == false || InrushWithinRating == false;

    private double? LifeAt(double? perNight) =>
        Facts.ContactLife is double life && perNight is double rate && rate > 0 ? life / rate : null;

    /// <summary>The duty of <paramref name="contacts"/> over the run in <paramref name="facts"/>: its switch-ons are
    /// the relay's <see cref="DeviceEventKind.LoadOn"/> events; chatter bursts are found among its on and off events as
    /// for the chatter finding.</summary>
    public static ContactDuty Of(ContactFacts contacts, RunFacts facts)
    {
        var ons = new List<double>();
        var switches = new List<double>();
        foreach (DiscreteEvent e in facts.DeviceEvents)
        {
            if (e.PartId != contacts.PartId || e.Kind is not (DeviceEventKind.LoadOn or DeviceEventKind.LoadOff)) continue;
            switches.Add(e.Time);
            if (e.Kind == DeviceEventKind.LoadOn) ons.Add(e.Time);
        }
        ons.Sort();
        switches.Sort();
        List<(double Start, double End, int Operations)> bursts = NightAnalysis.ChatterBursts(switches);
        int chatter = ons.Count(t => bursts.Any(b => t >= b.Start && t <= b.End));
        return new ContactDuty
        {
            Facts = contacts,
            Operations = ons.Count,
            ChatterOperations = chatter,
            Nights = facts.Nights.Count,
            FirstSwitchOn = ons.Count > 0 ? ons[0] : null,
            FirstChatter = bursts.Count > 0 ? bursts[0].Start : null,
        };
    }

    /// <summary>The duties of every switched load in <paramref name="facts"/>.</summary>
    public static IReadOnlyList<ContactDuty> All(RunFacts facts) => [.. facts.Contacts.Select(c => Of(c, facts))];
}
