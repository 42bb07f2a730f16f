using System.Security.Claims;
using CapReview.Reviews.Access;

namespace CapReview.Web.Identity;

/// <summary>Turns the signed-in principal (cookie or API token) into the domain's <see cref="Actor"/>.</summary>
public static class ActorFactory
{
    public const string DisplayNameClaim = "capreview:display-name";

    public static Actor? From(ClaimsPrincipal? principal)
    {
        string? id = principal?.FindFirstValue(ClaimTypes.NameIdentifier);
        if (principal?.Identity?.IsAuthenticated != true || id is null)
        {
            return null;
        }
        var roles = principal.FindAll(ClaimTypes.Role)
            .Select(c => Enum.TryParse(c.Value, out Role role) ? role : (Role?)null)
            .Where(r => r is not null)
            .Select(r => r!.Value)
            .ToHashSet();
        string name = principal.FindFirstValue(DisplayNameClaim) ?? principal.Identity.Name ?? id;
        return new Actor(id, name, roles);
    }
}
