using System.Globalization;
using NightSim.Units;

namespace NightSim.Tests.Units;

public sealed class EngineeringValueTests
{
    // Prefix factors: SI brochure (BIPM, 9th edition, 2019), table 7. "u" for micro and "K" for kilo are common practice.
    [Theory]
    [InlineData("1T", 1e12)]
    [InlineData("1G", 1e9)]
    [InlineData("2.2M", 2.2e6)]
    [InlineData("4.7k", 4.7e3)]
    [InlineData("1.5m", 1.5e-3)]
    [InlineData("3300u", 3.3e-3)]
    [InlineData("3300µ", 3.3e-3)]
    [InlineData("3300μ", 3.3e-3)]
    [InlineData("100n", 100e-9)]
    [InlineData("22p", 22e-12)]
    [InlineData("5f", 5e-15)]
    public void Every_Prefix_Scales_By_Its_Si_Factor(string text, double expected) =>
        Assert.Equal(expected, EngineeringValue.Parse(text), expected * 1e-12);

    // Letter as the decimal point: IEC 60062 resistor letter code ("4k7", "2R2", "1M5").
    [Theory]
    [InlineData("4k7", "Ω", 4.7e3)]
    [InlineData("2R2", "Ω", 2.2)]
    [InlineData("1M5", "Ω", 1.5e6)]
    [InlineData("4u7", "F", 4.7e-6)]
    [InlineData("4u7F", "F", 4.7e-6)]
    [InlineData("0R47", "Ω", 0.47)]
    [InlineData("4K7", "Ω", 4.7e3)]
    [InlineData("4.7K", "Ω", 4.7e3)]
    public void Letter_Between_Digits_Is_The_Decimal_Point(string text, string unit, double expected) =>
        Assert.Equal(expected, EngineeringValue.Parse(text, unit), expected * 1e-12);

    [Theory]
    [InlineData("3300uF", "F", 3.3e-3)]
    [InlineData("12V", "V", 12)]
    [InlineData("12 V", "V", 12)]
    [InlineData("0.5W", "W", 0.5)]
    [InlineData("1.5e-3", "A", 1.5e-3)]
    [InlineData("1E3", "Ω", 1e3)]
    [InlineData("-5mA", "A", -5e-3)]
    [InlineData("2F", "F", 2)]               // "F" alone is the unit farad, not femto
    [InlineData("10kohm", "Ω", 1e4)]
    [InlineData("10kΩ", "Ω", 1e4)]
    [InlineData("50Hz", "Hz", 50)]
    [InlineData("2h", "s", 7200)]            // 1 h = 3600 s (SI brochure, table 8)
    [InlineData("30min", "s", 1800)]         // 1 min = 60 s (SI brochure, table 8)
    [InlineData("20ms", "s", 0.02)]
    [InlineData("5%", "", 0.05)]
    [InlineData("90deg", "°", 90)]
    [InlineData("inf", "Ω", double.PositiveInfinity)]
    public void Units_Are_Accepted_When_They_Fit(string text, string unit, double expected) =>
        Assert.Equal(expected, EngineeringValue.Parse(text, unit), Math.Abs(expected) * 1e-12);

    [Theory]
    [InlineData("2.2meg", "Ω", "ambiguous")]
    [InlineData("2.2MEG", "Ω", "ambiguous")]
    [InlineData("1.5k7", "Ω", "ambiguous")]
    [InlineData("4,7k", "Ω", "decimal comma")]
    [InlineData("4x7", "Ω", "unknown suffix")]
    [InlineData("100nH", "F", "does not fit")]
    [InlineData("12V", "A", "does not fit")]
    [InlineData("k7", "Ω", "does not start with a number")]
    [InlineData("", "Ω", "empty")]
    [InlineData("1..2", "Ω", "not a number")]
    [InlineData("5V", "", "does not fit")]
    public void Bad_Or_Ambiguous_Suffixes_Are_Errors_With_A_Hint(string text, string unit, string expectedFragment)
    {
        Assert.False(EngineeringValue.TryParse(text, unit, out double _, out EngineeringValueError? error));
        Assert.NotNull(error);
        Assert.Contains(expectedFragment, error.Message, StringComparison.Ordinal);
        Assert.False(string.IsNullOrWhiteSpace(error.Hint));
    }

    [Fact]
    public void Meg_Error_Says_M_Is_Mega()
    {
        Assert.False(EngineeringValue.TryParse("1meg", "Ω", out double _, out string? error));
        Assert.Contains("use \"M\" for mega", error, StringComparison.Ordinal);
    }

    [Fact]
    public void Parse_Throws_Format_Exception_With_Hint() =>
        Assert.Contains("prefixes are", Assert.Throws<FormatException>(() => EngineeringValue.Parse("3q")).Message, StringComparison.Ordinal);

    [Theory]
    [InlineData(4700, "Ω", "4.7 kΩ")]
    [InlineData(100e-6, "F", "100 µF")]
    [InlineData(2.2e6, "Ω", "2.2 MΩ")]
    [InlineData(0.0015, "A", "1.5 mA")]
    [InlineData(12, "V", "12 V")]
    [InlineData(0, "V", "0 V")]
    [InlineData(999.99, "Ω", "1 kΩ")]
    [InlineData(-3.3e-9, "F", "-3.3 nF")]
    [InlineData(5400, "s", "1.5 h")]         // 1 h = 3600 s (SI brochure, table 8)
    [InlineData(90, "s", "1.5 min")]
    [InlineData(0.05, "", "0.05")]
    [InlineData(1e18, "Ω", "1e+18 Ω")]
    [InlineData(0.02, "s", "20 ms")]
    public void Format_Picks_The_Prefix(double value, string unit, string expected) =>
        Assert.Equal(expected, EngineeringValue.Format(value, unit));

    [Fact]
    public void Printing_And_Parsing_Round_Trip_Under_A_Decimal_Comma_Culture()
    {
        CultureInfo saved = CultureInfo.CurrentCulture;
        try
        {
            CultureInfo.CurrentCulture = CultureInfo.GetCultureInfo("de-DE");
            string text = EngineeringValue.Format(4.7e-6, "F");
            Assert.Equal("4.7 µF", text);
            Assert.Equal(4.7e-6, EngineeringValue.Parse(text, "F"), 1e-18);
        }
        finally
        {
            CultureInfo.CurrentCulture = saved;
        }
    }
}
