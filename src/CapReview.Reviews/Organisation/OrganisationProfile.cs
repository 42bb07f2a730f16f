namespace CapReview.Reviews.Organisation;

/// <summary>The organisation running this installation: its name on screens and packets, and how it writes money.</summary>
public sealed class OrganisationProfile
{
    /// <summary>There is one profile per installation.</summary>
    public const int SingletonId = 1;

    public int Id { get; set; } = SingletonId;

    public required string Name { get; set; }

    /// <summary>ISO 4217 code, e.g. EUR.</summary>
    public required string CurrencyCode { get; set; }

    /// <summary>The culture for numbers and dates, e.g. en-GB.</summary>
    public required string CultureName { get; set; }
}
