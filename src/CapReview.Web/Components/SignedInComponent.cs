using CapReview.Reviews.Access;
using CapReview.Web.Components.Layout;
using CapReview.Web.Identity;
using Microsoft.AspNetCore.Components;
using Microsoft.AspNetCore.Components.Authorization;

namespace CapReview.Web.Components;

/// <summary>
/// A page that acts for the signed-in user: the domain services receive the <see cref="Actor"/> built here. When the
/// open page's session ends elsewhere (<see cref="CircuitSessionCheck"/>), the page goes to the sign-in rather than
/// render for nobody.
/// </summary>
public abstract class SignedInComponent : ComponentBase, IHandleEvent
{
    /// <summary>The page's boundary (<c>@ref</c>), which shows a failure of the page's own actions.</summary>
    protected PageBoundary? Boundary { get; set; }

    [CascadingParameter]
    private Task<AuthenticationState>? AuthenticationState { get; set; }

    [Inject]
    private NavigationManager Navigation { get; set; } = default!;

    public override async Task SetParametersAsync(ParameterView parameters)
    {
        // Checked on the first parameters too: a page drawn while its session stood can turn interactive after the
        // session ended (its live connection then carries nobody), and must not render for nobody.
        if (RendererInfo.IsInteractive
            && parameters.TryGetValue(nameof(AuthenticationState), out Task<AuthenticationState>? next) && next is not null
            && (await next).User.Identity?.IsAuthenticated != true)
        {
            string back = "/" + Navigation.ToBaseRelativePath(Navigation.Uri);
            Navigation.NavigateTo("signin?ReturnUrl=" + Uri.EscapeDataString(back), forceLoad: true);
            return;
        }
        await base.SetParametersAsync(parameters);
    }

    /// <summary>
    /// Runs the page's own event handlers as <see cref="ComponentBase"/> does, but a failure is shown by the page's
    /// boundary instead of ending the browser's session: an error boundary only catches what its children throw, and
    /// the page is not its own child.
    /// </summary>
    async Task IHandleEvent.HandleEventAsync(EventCallbackWorkItem callback, object? arg)
    {
        Task task = callback.InvokeAsync(arg);
        if (!task.IsCompleted)
        {
            StateHasChanged();
        }
        try
        {
            await task;
        }
        catch (OperationCanceledException) when (task.IsCanceled)
        {
            return;
        }
        catch (Exception failure) when (Boundary is not null)
        {
            Boundary.Report(failure);
        }
        StateHasChanged();
    }

    protected async Task<Actor> ActorAsync()
    {
        var state = AuthenticationState is null ? null : await AuthenticationState;
        return ActorFactory.From(state?.User) ?? throw new InvalidOperationException("This page needs a signed-in user.");
    }
}
