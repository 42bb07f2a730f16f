using CapReview.Reviews.Display;
using CapReview.Web.Hosting;

namespace CapReview.Web.Formatting;

/// <summary>
/// Figures on screens by the one display rule (<see cref="NumberDisplay"/>), with what only screens need: moments in
/// the organisation's time zone and amounts written back into inputs.
/// </summary>
public sealed class DisplayFormat : NumberDisplay
{
    private readonly TimeZoneInfo _zone;

    public DisplayFormat(OrganisationOptions organisation)
        : base((organisation ?? throw new ArgumentNullException(nameof(organisation))).Culture(), organisation.CurrencyCode)
    {
        _zone = organisation.Zone();
    }

    /// <summary>A moment as the organisation reads it: in its time zone, in its culture's short date and time.</summary>
    public string Time(DateTimeOffset moment) => TimeZoneInfo.ConvertTime(moment, _zone).ToString("g", Culture);

    public string Time(DateTimeOffset? moment, string absent) => moment is DateTimeOffset m ? Time(m) : absent;

    /// <summary>An amount as typed into an input: no thousands separators, so it parses back unchanged.</summary>
    public string Editable(double value) => value.ToString("0.############", Culture);
}
