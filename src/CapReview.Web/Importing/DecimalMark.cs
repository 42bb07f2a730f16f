using System.Globalization;

namespace CapReview.Web.Importing;

/// <summary>The character a file writes between the whole and the fraction of a number.</summary>
public enum DecimalMark
{
    /// <summary>1,234.50: a point before the fraction, commas between thousands.</summary>
    Point,

    /// <summary>1.234,50: a comma before the fraction, points (or spaces) between thousands.</summary>
    Comma,
}

/// <summary>The number formats of the two marks, as the import reads text numbers.</summary>
public static class DecimalMarks
{
    private static readonly CultureInfo CommaCulture = MakeComma();

    public static CultureInfo Culture(DecimalMark mark) => mark == DecimalMark.Comma ? CommaCulture : CultureInfo.InvariantCulture;

    /// <summary>How a person recognises the mark: "1,234.50 (decimal point)".</summary>
    public static string Describe(DecimalMark mark) => mark == DecimalMark.Comma ? "1.234,50 (decimal comma)" : "1,234.50 (decimal point)";

    private static CultureInfo MakeComma()
    {
        var culture = (CultureInfo)CultureInfo.InvariantCulture.Clone();
        culture.NumberFormat.NumberDecimalSeparator = ",";
        culture.NumberFormat.NumberGroupSeparator = ".";
        culture.NumberFormat.PercentDecimalSeparator = ",";
        culture.NumberFormat.PercentGroupSeparator = ".";
        return CultureInfo.ReadOnly(culture);
    }
}
