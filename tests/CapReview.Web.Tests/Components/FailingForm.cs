using CapReview.Reviews.Common;
using Microsoft.AspNetCore.Components;
using Microsoft.AspNetCore.Components.Rendering;

namespace CapReview.Web.Tests.Components;

/// <summary>
/// A form whose one button fails the way a page's action can, unexpectedly or refused by the domain; what is typed
/// goes into the page's draft, as the pages' forms do.
/// </summary>
public sealed class FailingForm : ComponentBase
{
    [Parameter, EditorRequired] public FormDraft Draft { get; set; } = default!;

    [Parameter] public bool RefusedByTheDomain { get; set; }

    protected override void BuildRenderTree(RenderTreeBuilder builder)
    {
        builder.OpenElement(0, "input");
        builder.AddAttribute(1, "id", "note");
        builder.AddAttribute(2, "value", Draft.Note);
        builder.AddAttribute(3, "onchange", EventCallback.Factory.CreateBinder<string>(this, v => Draft.Note = v ?? "", Draft.Note));
        builder.CloseElement();
        builder.OpenElement(4, "button");
        builder.AddAttribute(5, "id", "fail");
        builder.AddAttribute(6, "onclick", EventCallback.Factory.Create(this, Fail));
        builder.CloseElement();
        builder.OpenElement(7, "button");
        builder.AddAttribute(8, "id", "save");
        builder.AddAttribute(9, "onclick", EventCallback.Factory.Create(this, () => Draft.Saves++));
        builder.CloseElement();
        builder.OpenElement(10, "output");
        builder.AddAttribute(11, "id", "saves");
        builder.AddContent(12, Draft.Saves);
        builder.CloseElement();
    }

    private void Fail()
    {
        if (RefusedByTheDomain)
        {
            throw new RuleViolationException("capitalLimit: the capital limit cannot be negative.");
        }
        throw new InvalidOperationException("the disk is full");
    }
}
