using System.Globalization;

namespace CapReview.Packets.Layout;

/// <summary>
/// Numbers as a packet prints them, in the organisation's culture: money to whole units with thousands separators,
/// rates to two decimals of a percent, each rounded half away from zero; dates and times in UTC, stated as such.
/// </summary>
public sealed class PacketFormat(CultureInfo culture, string currencyCode)
{
    public CultureInfo Culture { get; } = culture;

    public string CurrencyCode { get; } = currencyCode;

    public string Money(double value) =>
        Math.Round(value, 0, MidpointRounding.AwayFromZero).ToString("#,##0;−#,##0;0", Culture);

    public string Money(double? value, string absent) => value is double v ? Money(v) : absent;

    public string Money(decimal value) => Money((double)value);

    public string Percent(double fraction) =>
        Math.Round(fraction * 100, 2, MidpointRounding.AwayFromZero).ToString("#,##0.00;−#,##0.00;0.00", Culture) + " %";

    public string Percent(double? fraction, string absent) => fraction is double f ? Percent(f) : absent;

    /// <summary>The rate of return when it is unique, else "none" or "several".</summary>
    public string RateOfReturn(CapReview.Engine.Evaluation.Evaluation evaluation)
    {
        ArgumentNullException.ThrowIfNull(evaluation);
        return evaluation.RatesOfReturn.Count switch { 0 => "none", 1 => Percent(evaluation.RatesOfReturn[0]), _ => "several" };
    }

    public string Number(double value, int decimals) =>
        Math.Round(value, decimals, MidpointRounding.AwayFromZero).ToString("N" + decimals.ToString(CultureInfo.InvariantCulture), Culture).Replace("-", "−", StringComparison.Ordinal);

    public string Date(DateOnly date) => date.ToString("d MMMM yyyy", Culture);

    public string Time(DateTimeOffset time) => time.ToUniversalTime().ToString("d MMMM yyyy, HH:mm", Culture) + " UTC";
}
