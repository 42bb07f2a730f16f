using Microsoft.AspNetCore.Components;
using Microsoft.AspNetCore.Components.Rendering;

namespace CapReview.Web.Tests.Components;

/// <summary>A part of a page that cannot be drawn at all.</summary>
public sealed class BrokenPanel : ComponentBase
{
    protected override void BuildRenderTree(RenderTreeBuilder builder) => throw new InvalidOperationException("no figures to draw");
}
