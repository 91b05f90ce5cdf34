using System.Globalization;
using NightSim.Units;

namespace NightSim.Analysis;

/// <summary>
/// The relay drive's contacts against the lamp they switch: the steady current P / (V · power factor) and the load
/// kind's typical switch-on peak (common-practice multiples) against the contact rating, the lamp's voltage against the
/// contact voltage, and the run's switch-ons (chatter included) against the electrical life. Read from the contact
/// facts (the relay's switched-load role), never from part kinds.
/// </summary>
public sealed class ContactAnalyzer : IResultAnalyzer
{
    private static readonly CultureInfo s_inv = CultureInfo.InvariantCulture;

    public IEnumerable<Finding> Analyze(RunFacts facts, IReadOnlyList<AttributedInterval> intervals, IReadOnlyList<NightSummary> nights)
    {
        foreach (ContactDuty duty in ContactDuty.All(facts))
        {
            if (Weld(duty, facts) is Finding weld) yield return weld;
            if (Voltage(duty, facts) is Finding voltage) yield return voltage;
            if (Life(duty, facts) is Finding life) yield return life;
        }
    }

    private static string Amps(double a) => EngineeringValue.Format(a, "A", 3);

    private static string Head(ContactFacts c) => $"Relay {c.PartId} (relay drive, contacts)";

    private static DateTimeOffset? At(RunFacts facts, double? t) => t is double s ? facts.Clock(s) : null;

    private static Finding? Weld(ContactDuty duty, RunFacts facts)
    {
        if (!duty.MayWeld) return null;
        ContactFacts c = duty.Facts;
        var said = new List<string>();
        string pf = c.PowerFactor < 1 ? string.Create(s_inv, $" at a power factor of {c.PowerFactor:0.##}{(c.PowerFactorStated ? "" : " (typical for the kind; common practice)")}") : "";
        said.Add($"{Head(c)}: {c.LoadWords} draws {Amps(c.SteadyCurrent)} steady{pf}");
        if (duty.SteadyWithinRating == false)
            said.Add($", above the contacts' {Amps(c.ContactCurrent!.Value)} rating: they run hot and may weld");
        if (duty.InrushWithinRating == false)
        {
            string limit = c.InrushLimitStated
                ? $"the {Amps(c.InrushLimit!.Value)} switch-on peak the contacts are rated for"
                : string.Create(s_inv, $"the {Amps(c.InrushLimit!.Value)} general-purpose contacts take ({c.InrushLimitMultiple:0.#}× their {Amps(c.ContactCurrent!.Value)} resistive rating; common practice, from memory)");
            said.Add(string.Create(s_inv, $". At switch-on such a load typically draws {c.InrushLow:0.#}–{c.InrushHigh:0.#}× that for {c.InrushDuration} (common practice, from memory): up to {Amps(c.PeakInrush!.Value)}, above {limit}"));
        }
        said.Add(". The contacts may weld shut and keep the lamp on.");
        return new Finding(Severity.Warning, "relay-contacts-may-weld", string.Concat(said), WeldFix(duty), At(facts, duty.FirstSwitchOn), c.PartId);
    }

    private static string WeldFix(ContactDuty duty)
    {
        ContactFacts c = duty.Facts;
        string steady = duty.SteadyWithinRating == false
            ? $"Use a relay whose contacts are rated for at least {Amps(c.SteadyCurrent)} at {c.Voltage:0.##} V"
            : "";
        if (duty.InrushWithinRating != false) return steady + ", or let this relay drive a contactor rated for the load.";
        double peak = c.PeakInrush!.Value;
        string relay = string.Create(s_inv, $"Use a relay with an inrush (lamp-load) rating of at least {Amps(peak)}, or general-purpose contacts rated for at least {Amps(Math.Max(peak / c.InrushLimitMultiple, c.SteadyCurrent))}");
        string limiter = c.Kind switch
        {
            "incandescent" => "; or put an inrush limiter (an NTC thermistor in series with the lamp) in the lamp circuit; for a large lamp let the relay drive a contactor rated for filament lamps (utilisation category AC-5b, IEC 60947-4-1)",
            "led-driver" => "; or switch at the mains zero crossing, or fit an inrush current limiter before the driver; for large drivers let the relay drive a contactor rated for LED (capacitive) lamp loads",
            "fluorescent" => "; or let the relay drive a contactor rated for discharge lamps (utilisation category AC-5a, IEC 60947-4-1)",
            _ => "; or let the relay drive a contactor rated for the load",
        };
        return relay + limiter + ".";
    }

    private static Finding? Voltage(ContactDuty duty, RunFacts facts)
    {
        if (duty.VoltageWithinRating != false) return null;
        ContactFacts c = duty.Facts;
        return new Finding(Severity.Warning, "relay-contact-voltage",
            string.Create(s_inv, $"{Head(c)}: {c.LoadWords} runs on {c.Voltage:0.##} V, above the contacts' {c.ContactVoltage:0.##} V rating: they may not break the arc when they open, and the gap between them is not rated for that voltage."),
            string.Create(s_inv, $"Use a relay whose contacts are rated for at least {c.Voltage:0.##} V (250 V contacts for 230 V mains are usual; common practice)."),
            At(facts, duty.FirstSwitchOn), c.PartId);
    }

    private static Finding? Life(ContactDuty duty, RunFacts facts)
    {
        if (duty.LifeYears is not double years || duty.OperationsPerNight is not double perNight) return null;
        ContactFacts c = duty.Facts;
        double? without = duty.LifeYearsWithoutChatter;
        bool chatter = duty.ChatterOperations > 0;
        // Short of the service life: a warning. Chatter that at least halves the life is reported even when the
        // contacts still last: the chatter finding says the lamp flickers, this one says what it costs the relay.
        bool short_ = years < ContactDuty.ServiceYears;
        bool halved = chatter && (without is null || years < 0.5 * without.Value);
        if (!short_ && !halved) return null;
        string rate = string.Create(s_inv, $"the run switched the lamp on {perNight:0.#} time{(Math.Abs(perNight - 1) < 1e-9 ? "" : "s")} a night");
        string inChatter = chatter ? string.Create(s_inv, $", {duty.ChatterPerNight:0.#} of them in chatter bursts") : "";
        string last = string.Create(s_inv, $"The contacts' electrical life of {c.ContactLife:#,0} operations (a switch-on and its switch-off each, at the rated load; a lamp load wears them faster) lasts {duty.LifeNights:#,0} nights at this rate, about {Wording.Years(years)}");
        string compare = !chatter ? "" : without is double w ? $", against {Wording.Years(w)} without the chatter" : ", against hardly any wear without the chatter";
        string service = short_ ? string.Create(s_inv, $", short of the {ContactDuty.ServiceYears:0} years a fixed outdoor control is usually expected to last (our assumption)") : "";
        string fix = chatter
            ? "Stop the chatter: add hysteresis (positive feedback, or the timer's own 1/3 and 2/3 levels), an off-delay longer than the loop, and keep the lamp's light off the sensor."
            : "Use a relay with a longer electrical life, or switch less often (an off-delay, or a timer that holds the lamp on).";
        return new Finding(short_ ? Severity.Warning : Severity.Info, "relay-contact-life",
            $"{Head(c)}: {rate}{inChatter}. {last}{compare}{service}.", fix,
            At(facts, chatter ? duty.FirstChatter : duty.FirstSwitchOn), c.PartId);
    }
}
