using System.Globalization;
using CapReview.Reviews.Display;

namespace CapReview.Reviews.Tests.Display;

/// <summary>
/// The one display rule of docs/methods.md, with every expected string written out. Source: the rule itself ("round
/// half away from zero", U+2212 for a negative, no sign on zero) and the cultures' separators as ICU defines them
/// (CLDR: en-IE comma and point; sv-SE no-break space U+00A0 and comma, its own minus U+2212; fr-FR narrow no-break
/// space U+202F and comma).
/// </summary>
public sealed class NumberDisplayTests
{
    private static NumberDisplay In(string culture) => new(CultureInfo.GetCultureInfo(culture), "EUR");

    private static readonly NumberDisplay Irish = In("en-IE");

    [Theory]
    [InlineData(1234567.49, "1,234,567")]
    [InlineData(1234567.5, "1,234,568")]
    [InlineData(-1234567.5, "\u22121,234,568")]
    [InlineData(0.5, "1")]
    [InlineData(2.5, "3")]
    [InlineData(-2.5, "\u22123")]
    [InlineData(999.5, "1,000")]
    public void Money_is_whole_units_rounded_half_away_from_zero(double value, string expected) =>
        Assert.Equal(expected, Irish.Money(value));

    [Theory]
    [InlineData(-0.0, "0")]
    [InlineData(-0.4, "0")]
    [InlineData(-0.49999, "0")]
    public void Money_that_rounds_to_zero_carries_no_sign(double value, string expected) =>
        Assert.Equal(expected, Irish.Money(value));

    [Fact]
    public void Percents_have_two_decimals_and_a_spaced_sign()
    {
        Assert.Equal("12.50 %", Irish.Percent(0.125));
        Assert.Equal("\u22123.25 %", Irish.Percent(-0.0325));
        Assert.Equal("0.00 %", Irish.Percent(-0.00001));
        Assert.Equal("1,250.00 %", Irish.Percent(12.5));
        Assert.Equal("—", Irish.Percent(null, "—"));
    }

    [Fact]
    public void Numbers_keep_the_decimals_asked_and_the_same_minus()
    {
        Assert.Equal("0.13", Irish.Number(0.125, 2));
        Assert.Equal("\u22120.13", Irish.Number(-0.125, 2));
        Assert.Equal("0.00", Irish.Number(-0.004, 2));
        Assert.Equal("\u22121,234.6", Irish.Number(-1234.55, 1));
        Assert.Equal("3", Irish.Number(2.5, 0));
    }

    [Fact]
    public void Swedish_groups_with_a_no_break_space_and_points_with_a_comma()
    {
        var swedish = In("sv-SE");
        Assert.Equal("1\u00A0234\u00A0568", swedish.Money(1234567.5));
        Assert.Equal("\u22121\u00A0234\u00A0568", swedish.Money(-1234567.5));
        Assert.Equal("\u221212,50 %", swedish.Percent(-0.125));
        Assert.Equal("0,00", swedish.Number(-0.001, 2));
    }

    [Fact]
    public void French_groups_with_a_narrow_no_break_space()
    {
        var french = In("fr-FR");
        Assert.Equal("1\u202F234\u202F568", french.Money(1234567.5));
        Assert.Equal("\u221298\u202F765,43", french.Number(-98765.425, 2));
        Assert.Equal("7,25 %", french.Percent(0.0725));
        Assert.Equal("0", french.Money(-0.0));
    }

    [Fact]
    public void Money_from_a_stored_decimal_follows_the_same_rule()
    {
        Assert.Equal("2,001", Irish.Money(2000.5m));
        Assert.Equal("\u22122,001", Irish.Money(-2000.5m));
    }

    [Fact]
    public void Figures_that_are_not_numbers_are_not_shown_as_numbers()
    {
        Assert.Equal("—", Irish.Money(double.NaN));
        Assert.Equal("∞", Irish.Money(double.PositiveInfinity));
        Assert.Equal("\u2212∞", Irish.Percent(double.NegativeInfinity).Replace(" %", "", StringComparison.Ordinal));
    }

    [Fact]
    public void The_rate_of_return_is_absent_without_an_evaluation() =>
        Assert.Equal("n/a", Irish.RateOfReturn(null, "n/a"));
}
