using System.Security.Claims;
using Microsoft.AspNetCore.Identity;
using Microsoft.Extensions.Options;

namespace CapReview.Web.Identity;

/// <summary>Adds the display name, and the mark of a first password still to be changed, to the sign-in cookie so that pages need no lookup.</summary>
public sealed class DisplayNameClaimsFactory(UserManager<CapReviewUser> users, RoleManager<IdentityRole> roles, IOptions<IdentityOptions> options)
    : UserClaimsPrincipalFactory<CapReviewUser, IdentityRole>(users, roles, options)
{
    protected override async Task<ClaimsIdentity> GenerateClaimsAsync(CapReviewUser user)
    {
        ArgumentNullException.ThrowIfNull(user);
        ClaimsIdentity identity = await base.GenerateClaimsAsync(user).ConfigureAwait(false);
        identity.AddClaim(new Claim(ActorFactory.DisplayNameClaim, user.DisplayName));
        if (await FirstPassword.IsPendingAsync(UserManager, user).ConfigureAwait(false))
        {
            identity.AddClaim(new Claim(FirstPassword.Claim, "1"));
        }
        return identity;
    }
}
