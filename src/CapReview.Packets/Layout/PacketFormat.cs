using System.Globalization;
using CapReview.Reviews.Display;

namespace CapReview.Packets.Layout;

/// <summary>
/// Figures as a packet prints them, by the one display rule (<see cref="NumberDisplay"/>); dates and times in UTC,
/// stated as such, since a packet is read far from the organisation's clock.
/// </summary>
public sealed class PacketFormat(CultureInfo culture, string currencyCode) : NumberDisplay(culture, currencyCode)
{
    /// <summary>The rate of return when it is unique, else "none" or "several".</summary>
    public string RateOfReturn(CapReview.Engine.Evaluation.Evaluation evaluation)
    {
        ArgumentNullException.ThrowIfNull(evaluation);
        return RateOfReturn(evaluation, "—");
    }

    public string Date(DateOnly date) => date.ToString("d MMMM yyyy", Culture);

    public string Time(DateTimeOffset time) => time.ToUniversalTime().ToString("d MMMM yyyy, HH:mm", Culture) + " UTC";
}
