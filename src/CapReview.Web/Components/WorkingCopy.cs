using System.Text.Json;

namespace CapReview.Web.Components;

/// <summary>
/// A page's typed work kept in the browser: when it was kept, the saved state it started from (so that a copy older than
/// a later save says so rather than silently replacing it) and the work itself as the page wrote it.
/// </summary>
public sealed record WorkingCopy(DateTimeOffset KeptAt, string Base, string Work)
{
    public string ToJson() => JsonSerializer.Serialize(this);

    /// <summary>The copy, or null when the text is not one (an older format, or tampered with in the browser).</summary>
    public static WorkingCopy? FromJson(string? json)
    {
        if (string.IsNullOrEmpty(json))
        {
            return null;
        }
        try
        {
            var copy = JsonSerializer.Deserialize<WorkingCopy>(json);
            return copy is { Base: not null, Work: not null } ? copy : null;
        }
        catch (JsonException)
        {
            return null;
        }
    }
}
