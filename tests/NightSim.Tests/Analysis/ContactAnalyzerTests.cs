using NightSim.Analysis;
using NightSim.Devices;

namespace NightSim.Tests.Analysis;

/// <summary>The contact findings on hand-made runs (invented lamps and relays); the numbers in each message are worked
/// out here by hand.</summary>
public sealed class ContactAnalyzerTests
{
    private static List<Finding> Analyze(ContactFacts contacts, int nights, IEnumerable<double> on, IEnumerable<double> off) =>
        [.. new ContactAnalyzer().Analyze(ContactDutyTests.Run(nights, on, off, contacts), [], [])];

    private static readonly double[] s_dusk = [5 * 3600.0];
    private static readonly double[] s_late = [9 * 3600.0];

    [Fact]
    public void Weld_Warning_Fires_For_A_Filament_Lamp_Over_A_Small_Contact()
    {
        // 100 W filament lamp on 230 V: 0.4348 A steady (P/V), 15 × 0.4348 = 6.52 A at switch-on (common practice,
        // from memory), against a 1 A signal relay: 3 × 1 A = 3 A for general-purpose contacts (common practice).
        ContactFacts c = ContactDutyTests.Facts(100, LoadKind.Incandescent, rating: new ContactRating(1, 250, 1e5));
        Finding f = Assert.Single(Analyze(c, 1, s_dusk, s_late), x => x.Code == "relay-contacts-may-weld");
        Assert.Equal(Severity.Warning, f.Severity);
        Assert.Equal("K1", f.Part);
        Assert.Contains("relay drive", f.Message, StringComparison.Ordinal);
        Assert.Contains("435 mA steady", f.Message, StringComparison.Ordinal);
        Assert.Contains("10–15×", f.Message, StringComparison.Ordinal);
        Assert.Contains("up to 6.52 A", f.Message, StringComparison.Ordinal);
        Assert.Contains("3 A general-purpose contacts take", f.Message, StringComparison.Ordinal);
        Assert.Contains("may weld", f.Message, StringComparison.Ordinal);
        // The fix fits a filament lamp: an inrush rating of at least the peak, or 6.52/3 = 2.17 A general-purpose
        // contacts, an NTC inrush limiter, or a contactor for filament lamps.
        Assert.Contains("at least 6.52 A", f.Fix, StringComparison.Ordinal);
        Assert.Contains("2.17 A", f.Fix, StringComparison.Ordinal);
        Assert.Contains("NTC", f.Fix, StringComparison.Ordinal);
        Assert.Contains("AC-5b", f.Fix, StringComparison.Ordinal);
    }

    [Fact]
    public void No_Warning_For_A_Resistive_Load_Within_Its_Rating()
    {
        // 500 W heater on 230 V: 2.174 A steady and no switch-on peak (Ohm's law) against 5 A / 250 V contacts.
        ContactFacts c = ContactDutyTests.Facts(500, LoadKind.Resistive, rating: new ContactRating(5, 250, 1e5));
        Assert.Empty(Analyze(c, 1, s_dusk, s_late));
    }

    [Fact]
    public void A_Stated_Inrush_Rating_Replaces_The_Three_Times_Rule()
    {
        // 300 W filament lamp: 1.304 A steady, 19.57 A peak (15×). 10 A contacts take 30 A by the rule of thumb, so no
        // warning; with an inrush rating of only 15 A stated the peak is above it.
        ContactFacts generic = ContactDutyTests.Facts(300, LoadKind.Incandescent, rating: new ContactRating(10, 250));
        Assert.DoesNotContain(Analyze(generic, 1, s_dusk, s_late), f => f.Code == "relay-contacts-may-weld");
        ContactFacts rated = ContactDutyTests.Facts(300, LoadKind.Incandescent, rating: new ContactRating(10, 250, InrushCurrent: 15));
        Finding f = Assert.Single(Analyze(rated, 1, s_dusk, s_late), x => x.Code == "relay-contacts-may-weld");
        Assert.Contains("up to 19.6 A, above the 15 A switch-on peak the contacts are rated for", f.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Steady_Current_Above_The_Rating_May_Weld_Whatever_The_Kind()
    {
        // 600 W heater on 230 V draws 2.609 A against a 2 A contact.
        ContactFacts c = ContactDutyTests.Facts(600, LoadKind.Resistive, rating: new ContactRating(2, 250));
        Finding f = Assert.Single(Analyze(c, 1, s_dusk, s_late));
        Assert.Equal("relay-contacts-may-weld", f.Code);
        Assert.Contains("2.61 A steady, above the contacts' 2 A rating", f.Message, StringComparison.Ordinal);
        Assert.Contains("at least 2.61 A", f.Fix, StringComparison.Ordinal);
    }

    [Fact]
    public void Lamp_Voltage_Above_The_Contact_Voltage_Is_A_Warning()
    {
        // A relay rated 125 V switching a 230 V lamp.
        ContactFacts c = ContactDutyTests.Facts(12, LoadKind.LedDriver, rating: new ContactRating(10, 125));
        Finding f = Assert.Single(Analyze(c, 1, s_dusk, s_late));
        Assert.Equal("relay-contact-voltage", f.Code);
        Assert.Contains("runs on 230 V, above the contacts' 125 V rating", f.Message, StringComparison.Ordinal);
        Assert.Contains("at least 230 V", f.Fix, StringComparison.Ordinal);
    }

    [Fact]
    public void Chatter_That_Eats_The_Life_Is_A_Warning_With_The_Life_Without_It()
    {
        // One night: 40 switch-ons 1 s apart from 17:00 (a chatter burst), life 100 000 operations: 100 000/40 = 2500
        // nights = 6.8 years (365.2425 days a year), short of 10 years; without the chatter the count is 0.
        double dusk = 5 * 3600;
        var on = Enumerable.Range(0, 40).Select(k => dusk + k).ToList();
        var off = Enumerable.Range(0, 40).Select(k => dusk + k + 0.5).ToList();
        ContactFacts c = ContactDutyTests.Facts(12, LoadKind.LedDriver, rating: new ContactRating(10, 250, 100_000));
        Finding f = Assert.Single(Analyze(c, 1, on, off));
        Assert.Equal("relay-contact-life", f.Code);
        Assert.Equal(Severity.Warning, f.Severity);
        Assert.Contains("40 times a night, 40 of them in chatter bursts", f.Message, StringComparison.Ordinal);
        Assert.Contains("lasts 2,500 nights at this rate, about 6.8 years", f.Message, StringComparison.Ordinal);
        Assert.Contains("hardly any wear without the chatter", f.Message, StringComparison.Ordinal);
        Assert.Contains("hysteresis", f.Fix, StringComparison.Ordinal);
    }

    [Fact]
    public void Chatter_That_Halves_A_Long_Life_Is_Reported_For_Information()
    {
        // One clean switch-on plus a burst of 9 a night against 10 million operations: 1e7/10 = 1e6 nights (2,738
        // years), against 27,379 years without the chatter: far beyond the service life, but the chatter takes 90 %.
        double dusk = 5 * 3600;
        var on = new List<double> { dusk };
        var off = new List<double> { dusk + 3600 };
        for (int k = 0; k < 9; k++)
        {
            on.Add(dusk + 7200 + 2 * k);
            off.Add(dusk + 7200 + 2 * k + 1);
        }
        ContactFacts c = ContactDutyTests.Facts(12, LoadKind.LedDriver, rating: new ContactRating(10, 250, 1e7));
        Finding f = Assert.Single(Analyze(c, 1, on, off));
        Assert.Equal("relay-contact-life", f.Code);
        Assert.Equal(Severity.Info, f.Severity);
        Assert.Contains("about 2,738 years, against 27,379 years without the chatter", f.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void A_Clean_Night_On_A_Long_Life_Says_Nothing()
    {
        ContactFacts c = ContactDutyTests.Facts(12, LoadKind.LedDriver, rating: new ContactRating(10, 250, 1e5));
        Assert.Empty(Analyze(c, 1, s_dusk, s_late));
    }
}
