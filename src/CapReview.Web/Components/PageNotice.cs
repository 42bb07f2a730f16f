using CapReview.Reviews.Common;

namespace CapReview.Web.Components;

/// <summary>
/// The line a page shows after an action: what was done, or why the domain refused. A refusal never breaks the page and
/// nothing typed into the form is lost.
/// </summary>
public sealed class PageNotice
{
    public string? Message { get; private set; }

    public bool IsError { get; private set; }

    public void Show(string message, bool isError = false) => (Message, IsError) = (message, isError);

    public void Clear() => (Message, IsError) = (null, false);

    /// <summary>Runs the action; its result is the message, a <see cref="ReviewException"/> the error shown instead.</summary>
    public async Task RunAsync(Func<Task<string>> action)
    {
        ArgumentNullException.ThrowIfNull(action);
        try
        {
            Show(await action().ConfigureAwait(true));
        }
        catch (ReviewException ex)
        {
            Show(ex.Message, isError: true);
        }
    }
}
