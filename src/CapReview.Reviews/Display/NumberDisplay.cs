using System.Globalization;
using CapReview.Engine.Evaluation;

namespace CapReview.Reviews.Display;

/// <summary>
/// The one display rule for figures, on screens, in downloads' captions and in packets (docs/methods.md, "Numbers and
/// rounding"): money to whole currency units, rates to two decimals of a percent, other figures to the decimals asked,
/// each rounded half away from zero, grouped and pointed in the organisation's culture. A negative figure always
/// carries the minus sign U+2212, whatever the culture's own sign; a figure that rounds to zero carries none.
/// </summary>
public class NumberDisplay
{
    /// <summary>The minus sign every negative figure is written with.</summary>
    public const char Minus = '\u2212';

    public NumberDisplay(CultureInfo culture, string currencyCode)
    {
        ArgumentNullException.ThrowIfNull(culture);
        ArgumentNullException.ThrowIfNull(currencyCode);
        Culture = culture;
        CurrencyCode = currencyCode;
    }

    public CultureInfo Culture { get; }

    public string CurrencyCode { get; }

    public string Money(double value) => Rounded(value, 0);

    public string Money(double? value, string absent) => value is double v ? Money(v) : absent;

    public string Money(decimal value) => Money((double)value);

    /// <summary>A fraction as a percent to two decimals, followed by a space and the percent sign (0.125 → "12.50 %").</summary>
    public string Percent(double fraction) => Rounded(fraction * 100, 2) + " %";

    public string Percent(double? fraction, string absent) => fraction is double f ? Percent(f) : absent;

    public string Number(double value, int decimals) => Rounded(value, decimals);

    /// <summary>The rate of return when it is unique, else "none" or "several"; <paramref name="absent"/> without an evaluation.</summary>
    public string RateOfReturn(Evaluation? evaluation, string absent = "—") => evaluation?.RatesOfReturn.Count switch
    {
        null => absent,
        0 => "none",
        1 => Percent(evaluation.RatesOfReturn[0]),
        _ => "several",
    };

    private string Rounded(double value, int decimals)
    {
        if (!double.IsFinite(value))
        {
            return double.IsNaN(value) ? "—" : value > 0 ? "∞" : Minus + "∞";
        }
        double rounded = Math.Round(value, decimals, MidpointRounding.AwayFromZero);
        // The sign is written by hand: the cultures disagree on it (U+2212 in Swedish, "-" in Irish English), and a
        // figure that rounds to zero (−0.4, or −0.0 itself) is shown as zero, not as "−0".
        string digits = Math.Abs(rounded).ToString("N" + decimals.ToString(CultureInfo.InvariantCulture), Culture);
        return rounded < 0 ? Minus + digits : digits;
    }
}
