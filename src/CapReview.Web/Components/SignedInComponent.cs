using CapReview.Reviews.Access;
using CapReview.Web.Identity;
using Microsoft.AspNetCore.Components;
using Microsoft.AspNetCore.Components.Authorization;

namespace CapReview.Web.Components;

/// <summary>
/// A page that acts for the signed-in user: the domain services receive the <see cref="Actor"/> built here. When the
/// open page's session ends elsewhere (<see cref="CircuitSessionCheck"/>), the page goes to the sign-in rather than
/// render for nobody.
/// </summary>
public abstract class SignedInComponent : ComponentBase
{
    [CascadingParameter]
    private Task<AuthenticationState>? AuthenticationState { get; set; }

    [Inject]
    private NavigationManager Navigation { get; set; } = default!;

    public override async Task SetParametersAsync(ParameterView parameters)
    {
        if (RendererInfo.IsInteractive && AuthenticationState is not null
            && parameters.TryGetValue(nameof(AuthenticationState), out Task<AuthenticationState>? next) && next is not null
            && (await next).User.Identity?.IsAuthenticated != true)
        {
            string back = "/" + Navigation.ToBaseRelativePath(Navigation.Uri);
            Navigation.NavigateTo("signin?ReturnUrl=" + Uri.EscapeDataString(back), forceLoad: true);
            return;
        }
        await base.SetParametersAsync(parameters);
    }

    protected async Task<Actor> ActorAsync()
    {
        var state = AuthenticationState is null ? null : await AuthenticationState;
        return ActorFactory.From(state?.User) ?? throw new InvalidOperationException("This page needs a signed-in user.");
    }
}
