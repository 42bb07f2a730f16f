using CapReview.Web.Components;
using CapReview.Web.Components.Layout;
using Microsoft.AspNetCore.Components;
using Microsoft.AspNetCore.Components.Rendering;

namespace CapReview.Web.Tests.Components;

/// <summary>A page whose own button fails, with a field it keeps in its own state, inside its boundary as the pages do.</summary>
public sealed class FailingPage : SignedInComponent
{
    private string _typed = "";

    protected override void BuildRenderTree(RenderTreeBuilder builder)
    {
        builder.OpenComponent<PageBoundary>(0);
        builder.AddComponentParameter(1, nameof(PageBoundary.Area), "The proposal");
        builder.AddComponentParameter(2, nameof(PageBoundary.ChildContent), (RenderFragment)(content =>
        {
            content.OpenElement(0, "input");
            content.AddAttribute(1, "id", "title");
            content.AddAttribute(2, "value", _typed);
            content.AddAttribute(3, "onchange", EventCallback.Factory.CreateBinder<string>(this, v => _typed = v ?? "", _typed));
            content.CloseElement();
            content.OpenElement(4, "button");
            content.AddAttribute(5, "id", "save");
            content.AddAttribute(6, "onclick", EventCallback.Factory.Create(this, SaveAsync));
            content.CloseElement();
        }));
        builder.AddComponentReferenceCapture(3, boundary => Boundary = (PageBoundary)boundary);
        builder.CloseComponent();
    }

    private async Task SaveAsync()
    {
        await Task.Yield();
        throw new InvalidOperationException("the connection to the database was lost");
    }
}
