using NightSim.Devices;

namespace NightSim.Tests.Devices;

/// <summary>
/// The load-kind lookup table: every kind has one row, the words round-trip, and each row holds the value of the trade
/// it claims. Sources beside each check.
/// </summary>
public sealed class LoadInrushTableTests
{
    [Fact]
    public void Every_Kind_Has_Exactly_One_Row_With_Its_Source()
    {
        foreach (LoadKind kind in Enum.GetValues<LoadKind>())
        {
            LoadInrush row = Assert.Single(LoadInrushTable.Rows, r => r.Kind == kind);
            Assert.Same(row, LoadInrushTable.For(kind));
            Assert.Same(row, LoadInrushTable.ForWord(row.Word));
            Assert.False(string.IsNullOrWhiteSpace(row.Source));
            Assert.InRange(row.MultipleLow, 1.0, row.MultipleHigh);
            Assert.InRange(row.PowerFactor, 0.05, 1.0);
        }
        Assert.Equal(["resistive", "incandescent", "led-driver", "fluorescent"], LoadInrushTable.Words);
        Assert.Null(LoadInrushTable.ForWord("halogen"));
    }

    [Fact]
    public void A_Resistive_Load_Has_No_Inrush_And_Unity_Power_Factor()
    {
        // Ohm's law: a resistance draws V/R from the first instant, in phase with the voltage (power factor 1).
        LoadInrush r = LoadInrushTable.For(LoadKind.Resistive);
        Assert.Equal(1.0, r.MultipleLow);
        Assert.Equal(1.0, r.MultipleHigh);
        Assert.Equal(1.0, r.PowerFactor);
        Assert.Equal(0.0, r.Duration);
    }

    [Fact]
    public void A_Cold_Filament_Draws_10_To_15_Times_For_A_Few_Milliseconds()
    {
        // Common practice, from memory: tungsten's cold resistance is about 1/10 to 1/15 of its hot resistance, so a
        // filament lamp's first half-cycle draws 10–15× its working current; a filament is resistive (power factor 1).
        LoadInrush r = LoadInrushTable.For(LoadKind.Incandescent);
        Assert.Equal(10.0, r.MultipleLow);
        Assert.Equal(15.0, r.MultipleHigh);
        Assert.Equal(1.0, r.PowerFactor);
        Assert.InRange(r.Duration, 1e-3, 10e-3); // within a 50 Hz half-cycle (10 ms): "a few milliseconds"
        Assert.Contains("common practice, from memory", r.Source, StringComparison.OrdinalIgnoreCase);
    }

    [Fact]
    public void An_Led_Driver_Peak_Is_Higher_And_Far_Shorter_Than_A_Filaments()
    {
        // Common practice, from memory: a driver's input capacitor charging from the mains gives a peak of some 40–100×
        // the working current lasting well under a millisecond; drivers with power-factor correction run near 0.9.
        LoadInrush led = LoadInrushTable.For(LoadKind.LedDriver), filament = LoadInrushTable.For(LoadKind.Incandescent);
        Assert.Equal(40.0, led.MultipleLow);
        Assert.Equal(100.0, led.MultipleHigh);
        Assert.True(led.MultipleHigh > filament.MultipleHigh);
        Assert.True(led.Duration < 1e-3 && led.Duration < filament.Duration);
        Assert.Equal(0.9, led.PowerFactor);
    }

    [Fact]
    public void A_Magnetic_Ballast_Draws_5_To_10_Times_At_A_Power_Factor_Of_About_A_Half()
    {
        // Common practice, from memory: fluorescent lamps on a magnetic ballast 5–10× at switch-on; an uncorrected
        // magnetic ballast runs at a power factor of about 0.5.
        LoadInrush r = LoadInrushTable.For(LoadKind.Fluorescent);
        Assert.Equal(5.0, r.MultipleLow);
        Assert.Equal(10.0, r.MultipleHigh);
        Assert.Equal(0.5, r.PowerFactor);
    }

    [Fact]
    public void General_Purpose_Contacts_Take_Three_Times_Their_Resistive_Rating_Unless_An_Inrush_Rating_Is_Stated()
    {
        // Common practice, from memory: a general-purpose relay switches a filament lamp of about a fifth of its
        // resistive rating; 15× a fifth of the rating is 3× the rating.
        Assert.Equal(15.0 / 5.0, ContactRating.GeneralPurposeInrushMultiple);
        Assert.Equal(30.0, new ContactRating(Current: 10).InrushLimit);
        Assert.False(new ContactRating(Current: 10).InrushStated);
        Assert.Equal(80.0, new ContactRating(Current: 10, InrushCurrent: 80).InrushLimit);
        Assert.True(new ContactRating(Current: 10, InrushCurrent: 80).InrushStated);
        Assert.Null(ContactRating.Unknown.InrushLimit);
    }
}
