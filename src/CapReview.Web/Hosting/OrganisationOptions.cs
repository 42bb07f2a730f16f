using System.Globalization;
using CapReview.Reviews.Organisation;

namespace CapReview.Web.Hosting;

/// <summary>The organisation written to a new database; afterwards the database holds it.</summary>
public sealed class OrganisationOptions
{
    public string Name { get; set; } = "Tarnby Components Ltd";

    public string CurrencyCode { get; set; } = "EUR";

    public string CultureName { get; set; } = "en-IE";

    public OrganisationProfile ToProfile() => new() { Name = Name, CurrencyCode = CurrencyCode, CultureName = CultureName };

    public CultureInfo Culture() => CultureInfo.GetCultureInfo(CultureName);
}
