namespace CapReview.Reviews.Preferences;

/// <summary>One thing the app remembers for a user between visits, such as the cycle they last worked on or a page's filters.</summary>
public sealed class UserPreference
{
    public int Id { get; set; }

    public required string UserId { get; set; }

    public required string Name { get; set; }

    public required string Value { get; set; }

    public DateTimeOffset UpdatedAt { get; set; }
}
