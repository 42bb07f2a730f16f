using System.Globalization;
using CapReview.Web.Hosting;

namespace CapReview.Web.Formatting;

/// <summary>
/// The one rounding rule for screens: money to whole currency units, rates to two decimals of a percent, periods to
/// two decimals, each rounded half away from zero, in the organisation's culture. The engine keeps full precision.
/// </summary>
public sealed class DisplayFormat
{
    private readonly CultureInfo _culture;
    private readonly string _currency;
    private readonly TimeZoneInfo _zone;

    public DisplayFormat(OrganisationOptions organisation)
    {
        ArgumentNullException.ThrowIfNull(organisation);
        _culture = organisation.Culture();
        _currency = organisation.CurrencyCode;
        _zone = organisation.Zone();
    }

    public CultureInfo Culture => _culture;

    public string CurrencyCode => _currency;

    public string Money(double value) =>
        Math.Round(value, 0, MidpointRounding.AwayFromZero).ToString("#,##0;−#,##0;0", _culture);

    public string Money(double? value, string absent) => value is double v ? Money(v) : absent;

    public string Percent(double fraction) =>
        (Math.Round(fraction * 100, 2, MidpointRounding.AwayFromZero)).ToString("#,##0.00;−#,##0.00;0.00", _culture) + " %";

    public string Percent(double? fraction, string absent) => fraction is double f ? Percent(f) : absent;

    public string Number(double value, int decimals) =>
        Math.Round(value, decimals, MidpointRounding.AwayFromZero).ToString("N" + decimals.ToString(CultureInfo.InvariantCulture), _culture);

    /// <summary>The rate of return when it is unique, else "none" or "several"; <paramref name="absent"/> without an evaluation.</summary>
    public string RateOfReturn(CapReview.Engine.Evaluation.Evaluation? evaluation, string absent = "—") => evaluation?.RatesOfReturn.Count switch
    {
        null => absent,
        0 => "none",
        1 => Percent(evaluation.RatesOfReturn[0]),
        _ => "several",
    };

    /// <summary>A moment as the organisation reads it: in its time zone, in its culture's short date and time.</summary>
    public string Time(DateTimeOffset moment) => TimeZoneInfo.ConvertTime(moment, _zone).ToString("g", _culture);

    public string Time(DateTimeOffset? moment, string absent) => moment is DateTimeOffset m ? Time(m) : absent;

    /// <summary>An amount as typed into an input: no thousands separators, so it parses back unchanged.</summary>
    public string Editable(double value) => value.ToString("0.############", _culture);
}
