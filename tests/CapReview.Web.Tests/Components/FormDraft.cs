namespace CapReview.Web.Tests.Components;

/// <summary>What the user typed and did, held by the page above its boundary.</summary>
public sealed class FormDraft
{
    public string Note { get; set; } = "";

    public int Saves { get; set; }
}
