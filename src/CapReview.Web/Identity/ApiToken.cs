namespace CapReview.Web.Identity;

/// <summary>A personal API token: only its SHA-256 is stored; the token itself is shown once when issued.</summary>
public sealed class ApiToken
{
    public int Id { get; set; }

    public required string UserId { get; set; }

    public required string Name { get; set; }

    /// <summary>Lower-case hex SHA-256 of the token.</summary>
    public required string TokenHash { get; set; }

    public DateTimeOffset CreatedAt { get; set; }

    public DateTimeOffset? RevokedAt { get; set; }
}
