using System.Globalization;
using CapReview.Reviews.Organisation;

namespace CapReview.Web.Hosting;

/// <summary>The organisation written to a new database; afterwards the database holds it.</summary>
public sealed class OrganisationOptions
{
    public string Name { get; set; } = "Tarnby Components Ltd";

    public string CurrencyCode { get; set; } = "EUR";

    public string CultureName { get; set; } = "en-IE";

    /// <summary>The time zone dates and times are shown in (an IANA id such as Europe/Dublin), whatever the server's own.</summary>
    public string TimeZone { get; set; } = "Europe/Dublin";

    public OrganisationProfile ToProfile() => new() { Name = Name, CurrencyCode = CurrencyCode, CultureName = CultureName };

    public CultureInfo Culture() => CultureInfo.GetCultureInfo(CultureName);

    public TimeZoneInfo Zone()
    {
        try
        {
            return TimeZoneInfo.FindSystemTimeZoneById(TimeZone);
        }
        catch (TimeZoneNotFoundException)
        {
            throw new InvalidOperationException($"Organisation:TimeZone “{TimeZone}” is not a time zone this server knows; give an IANA id such as Europe/Dublin.");
        }
    }
}
