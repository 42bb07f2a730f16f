using System.Globalization;
using CapReview.Engine.Specifications;
using CapReview.Web.Formatting;
using CapReview.Web.Hosting;
using CapReview.Web.QuickEvaluation;

namespace CapReview.Web.Tests.QuickEvaluation;

/// <summary>Screens and inputs follow the organisation's culture and time zone (separators as .NET's CLDR data gives them; common practice, no source).</summary>
public sealed class OrganisationCultureTests
{
    private static DisplayFormat Format(string culture, string zone) => new(new OrganisationOptions { CultureName = culture, CurrencyCode = "EUR", TimeZone = zone });

    [Fact]
    public void Money_rates_and_times_are_written_in_the_organisations_culture_and_zone()
    {
        var german = Format("de-DE", "Europe/Berlin");
        Assert.Equal("1.234.568", german.Money(1_234_567.5));
        Assert.Equal("−1.234", german.Money(-1_234.4));
        Assert.Equal("7,25 %", german.Percent(0.0725));
        Assert.Equal("15.01.2027 13:00", german.Time(new DateTimeOffset(2027, 1, 15, 12, 0, 0, TimeSpan.Zero)));

        var irish = Format("en-IE", "Europe/Dublin");
        Assert.Equal("1,234,568", irish.Money(1_234_567.5));
        // Summer time in Dublin is an hour ahead of UTC.
        Assert.Equal("15/07/2027 13:00", irish.Time(new DateTimeOffset(2027, 7, 15, 12, 0, 0, TimeSpan.Zero)));
    }

    [Fact]
    public void Inputs_are_read_in_the_same_culture_they_are_shown_in()
    {
        var culture = CultureInfo.GetCultureInfo("de-DE");
        var draft = new ModelDraft { Horizon = "5", MarrPercent = "7,5" };
        draft.Elements.Add(new ElementDraft { Type = ElementKind.Single, Label = "Anlage", Category = Engine.CashFlows.CashFlowCategory.Capital, Period = "0", Amount = "−12.500,75" });
        draft.Elements.Add(new ElementDraft { Type = ElementKind.Geometric, Label = "Ersparnis", First = "1", Last = "5", Amount = "3.000", GrowthPercent = "2,5" });
        var reading = draft.Read(culture);
        Assert.Empty(reading.Errors);
        Assert.Equal(0.075, reading.Spec.Rate!.Value!.Value, 15);
        Assert.Equal(-12_500.75, reading.Spec.Elements![0]!.Amount);
        Assert.Equal(3_000, reading.Spec.Elements[1]!.Amount);
        Assert.Equal(0.025, reading.Spec.Elements[1]!.Growth!.Value, 15);
        // What the page writes into an input reads back unchanged.
        var shown = ElementDraft.FromSpec(reading.Spec.Elements[0]!, culture);
        Assert.Equal("-12500,75", shown.Amount);
    }

    [Fact]
    public void An_unknown_time_zone_is_named_at_start_up()
    {
        var ex = Assert.Throws<InvalidOperationException>(() => Format("en-IE", "Atlantis/Capital"));
        Assert.Contains("Organisation:TimeZone", ex.Message, StringComparison.Ordinal);
    }
}
