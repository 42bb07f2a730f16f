using CapReview.Reviews.Access;
using CapReview.Web.Identity;
using Microsoft.AspNetCore.Components;
using Microsoft.AspNetCore.Components.Authorization;

namespace CapReview.Web.Components;

/// <summary>A page that acts for the signed-in user: the domain services receive the <see cref="Actor"/> built here.</summary>
public abstract class SignedInComponent : ComponentBase
{
    [CascadingParameter]
    private Task<AuthenticationState>? AuthenticationState { get; set; }

    protected async Task<Actor> ActorAsync()
    {
        var state = AuthenticationState is null ? null : await AuthenticationState;
        return ActorFactory.From(state?.User) ?? throw new InvalidOperationException("This page needs a signed-in user.");
    }
}
