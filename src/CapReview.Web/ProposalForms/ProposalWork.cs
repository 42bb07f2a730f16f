using System.Text.Json;
using System.Text.Json.Serialization;
using CapReview.Web.QuickEvaluation;

namespace CapReview.Web.ProposalForms;

/// <summary>
/// Everything a lead has typed in the proposal editor as one document, text kept as typed (a half-typed number too):
/// what the unsaved-work guard compares and keeps in the browser, and what a recovery puts back on the page.
/// </summary>
public sealed class ProposalWork
{
    // Populate: the drafts' lists and sub-forms are get-only, filled in place as the page fills them.
    private static readonly JsonSerializerOptions Options = new()
    {
        PreferredObjectCreationHandling = JsonObjectCreationHandling.Populate,
    };

    public ProposalForm Form { get; init; } = new();

    public ModelDraft Model { get; init; } = new();

    public static string Write(ProposalForm form, ModelDraft model) =>
        JsonSerializer.Serialize(new ProposalWork { Form = form, Model = model }, Options);

    /// <summary>The work, or null when the text is not a document of this editor (written by an older one, or altered).</summary>
    public static ProposalWork? Read(string json)
    {
        try
        {
            return JsonSerializer.Deserialize<ProposalWork>(json, Options);
        }
        catch (JsonException)
        {
            return null;
        }
        catch (NotSupportedException)
        {
            return null;
        }
    }
}
