using System.Globalization;
using NightSim.Analysis;
using NightSim.Units;

namespace NightSim.Reporting;

/// <summary>The contacts-against-the-lamp summary in words, shared by the terminal and the page (report.json holds
/// the numbers): the load, its steady and switch-on current, the rating and verdict, the operations and the life.</summary>
public static class ContactText
{
    private static readonly CultureInfo s_inv = CultureInfo.InvariantCulture;

    private static string Amps(double a) => EngineeringValue.Format(a, "A", 3);

    /// <summary>"K1 → lamp".</summary>
    public static string Title(ContactDuty d) => $"{d.Facts.PartId} → {d.Facts.Load}";

    /// <summary>The summary lines of <paramref name="d"/>.</summary>
    public static IReadOnlyList<ContactLine> Lines(ContactDuty d)
    {
        ContactFacts c = d.Facts;
        var lines = new List<ContactLine>();
        string kind = c.KindTitle ?? "load of unstated kind (give loadKind)";
        lines.Add(new("load", string.Create(s_inv, $"{c.PowerWatts:0.##} W {kind} on {c.Voltage:0.##} V")));
        string formula = c.PowerFactor < 1 || c.PowerFactorStated
            ? string.Create(s_inv, $" = {c.PowerWatts:0.##} W / ({c.Voltage:0.##} V × {c.PowerFactor:0.##}), power factor {(c.PowerFactorStated ? "as stated" : "typical for the kind (common practice)")}")
            : string.Create(s_inv, $" = {c.PowerWatts:0.##} W / {c.Voltage:0.##} V");
        lines.Add(new("steady current", Amps(c.SteadyCurrent) + formula, d.SteadyWithinRating == false));
        if (c.PeakInrush is double peak)
        {
            string range = c.InrushHigh <= 1 ? "none: the steady current from the first instant" : string.Create(s_inv,
                $"typically {c.InrushLow:0.#}–{c.InrushHigh:0.#}× for {c.InrushDuration} (common practice, from memory): up to {Amps(peak)}");
            lines.Add(new("switch-on peak", range, d.InrushWithinRating == false));
        }
        else
        {
            lines.Add(new("switch-on peak", "not known: state the load's loadKind (resistive, incandescent, led-driver, fluorescent)"));
        }
        lines.Add(Rating(d));
        lines.Add(new("operations", Operations(d)));
        if (Life(d) is ContactLine life) lines.Add(life);
        return lines;
    }

    private static ContactLine Rating(ContactDuty d)
    {
        ContactFacts c = d.Facts;
        if (c.ContactCurrent is null && c.ContactVoltage is null && c.InrushLimit is null)
            return new("contact rating", "not stated: give the relay's contactCurrent, contactVoltage and contactLife from its data");
        var parts = new List<string>();
        if (c.ContactCurrent is double a) parts.Add(Amps(a) + (d.SteadyWithinRating == false ? " (steady current above it)" : ""));
        if (c.ContactVoltage is double v) parts.Add(string.Create(s_inv, $"{v:0.##} V") + (d.VoltageWithinRating == false ? " (load voltage above it)" : ""));
        if (c.InrushLimit is double limit)
        {
            string what = c.InrushLimitStated ? "inrush rating" : string.Create(s_inv, $"{c.InrushLimitMultiple:0.#}× the resistive rating; common practice, from memory");
            parts.Add($"switch-on up to {Amps(limit)} ({what})" + (d.InrushWithinRating == false ? ", the peak is above it" : ""));
        }
        bool problem = d.MayWeld || d.VoltageWithinRating == false;
        string verdict = problem
            ? (d.MayWeld ? ": the contacts may weld" : ": the contacts may not break the arc")
            : d.SteadyWithinRating is null && d.VoltageWithinRating is null ? "" : ": within the rating";
        return new("contact rating", string.Join(", ", parts) + verdict, problem);
    }

    private static string Operations(ContactDuty d)
    {
        string chatter = d.ChatterOperations == 0 ? "none in chatter" : string.Create(s_inv, $"{d.ChatterOperations} in chatter");
        if (d.Nights > 1 && d.OperationsPerNight is double perNight)
            return string.Create(s_inv, $"{d.Operations} switch-on{Plural(d.Operations)} in {d.Nights} nights ({perNight:0.#} a night), {chatter}");
        return string.Create(s_inv, $"{d.Operations} switch-on{Plural(d.Operations)} in the {(d.Nights == 1 ? "night" : "run")}, {chatter}");
    }

    private static string Plural(int n) => n == 1 ? "" : "s";

    private static ContactLine? Life(ContactDuty d)
    {
        ContactFacts c = d.Facts;
        if (c.ContactLife is not double life) return null;
        string rated = string.Create(s_inv, $"{life:#,0} operations");
        if (d.LifeYears is not double years)
            return new("electrical life", rated + (d.Nights > 0 ? ": no switch-on in the run" : ": a plain transient has no nights to count against it"));
        string without = d.ChatterOperations == 0 ? "" : d.LifeYearsWithoutChatter is double w ? $" ({Wording.Years(w)} without the chatter)" : " (hardly any wear without the chatter)";
        return new("electrical life", string.Create(s_inv, $"{rated}: {d.LifeNights:#,0} nights, about {Wording.Years(years)} at this rate{without}"),
            years < ContactDuty.ServiceYears);
    }
}
