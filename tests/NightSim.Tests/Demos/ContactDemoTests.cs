using NightSim.Analysis;
using NightSim.Netlist;
using NightSim.Reporting;

namespace NightSim.Tests.Demos;

/// <summary>
/// The demos that state their lamp's kind and their relay's contact rating (invented values): the garden-path lamp is
/// a 12 W LED lamp behind a driver on 10 A / 250 V contacts, so the report shows its currents within the rating; the
/// self-lit dusk switch chatters, and the chatter eats the contacts' electrical life.
/// </summary>
public sealed class ContactDemoTests
{
    [Fact]
    public void Garden_Path_Report_Shows_The_Lamp_Within_Its_Contact_Rating()
    {
        NightReport report = DemoRuns.Run("garden-path").Report;
        PartDefinition relay = NetlistLoader.Load(DemoRuns.Netlist("garden-path")).Part("K1")!;
        ContactDuty d = Assert.Single(report.Contacts);
        // I = P / (V · cos φ) (textbook AC power) with the driver's typical 0.9 (common practice, from memory).
        double steady = relay.Parameters.Number("loadPower") / (230.0 * 0.9);
        Assert.Equal(steady, d.Facts.SteadyCurrent, 12);
        // LED driver switch-on up to 100× (common practice, from memory), against 3 × 10 A (common practice).
        Assert.Equal(100 * steady, d.Facts.PeakInrush!.Value, 9);
        Assert.Equal(3 * relay.Parameters.Number("contactCurrent"), d.Facts.InrushLimit);
        Assert.False(d.MayWeld);
        Assert.True(d.VoltageWithinRating);
        // One clean night: one switch-on, so the 100 000-operation life lasts 100 000 nights.
        Assert.Equal(1, d.Operations);
        Assert.Equal(0, d.ChatterOperations);
        Assert.Equal(relay.Parameters.Number("contactLife"), d.LifeNights);
        Assert.DoesNotContain(report.Findings, f => f.Code.StartsWith("relay-contact", StringComparison.Ordinal));
    }

    [Fact]
    public void Self_Lit_Chatter_Eats_The_Contacts_Life()
    {
        NightReport report = DemoRuns.Run("dusk-switch-self-lit").Report;
        ContactDuty d = Assert.Single(report.Contacts);
        NightSummary night = Assert.Single(report.Nights);
        // Every switch-on of the night is an operation (the relay's on/off transitions are twice the switch-ons).
        Assert.InRange(night.RelayOperations - 2 * d.Operations, -1, 0);
        Assert.True(d.ChatterOperations > 0.9 * d.Operations, $"{d.ChatterOperations} of {d.Operations} in chatter");
        Assert.Equal(1e5 / d.Operations, d.LifeNights!.Value, 6);
        Finding life = Assert.Single(report.Findings, f => f.Code == "relay-contact-life");
        Assert.Equal(Severity.Warning, life.Severity);
        Assert.Contains("in chatter bursts", life.Message, StringComparison.Ordinal);
        Assert.Contains("short of the 10 years", life.Message, StringComparison.Ordinal);
    }
}
