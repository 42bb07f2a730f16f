using System.Globalization;
using CapReview.Engine.Evaluation;
using CapReview.Engine.Measures;
using CapReview.Engine.Validation;

namespace CapReview.Web.QuickEvaluation;

/// <summary>The quick evaluation page's state: the draft, the latest evaluation, and the errors by field.</summary>
public sealed class QuickEvaluationState(ModelDraft draft, CultureInfo culture)
{
    private Dictionary<string, string> _errors = [];

    public ModelDraft Draft { get; } = draft;

    public Evaluation? Result { get; private set; }

    public IReadOnlyList<ProfilePoint> Profile { get; private set; } = [];

    public IReadOnlyList<InputError> Errors { get; private set; } = [];

    /// <summary>The first message for a field path such as <c>elements[2].amount</c>, or null.</summary>
    public string? ErrorFor(string field) => _errors.GetValueOrDefault(field);

    /// <summary>Reads the draft and evaluates it; unreadable fields are named once, by the reader rather than the engine.</summary>
    public void Recalculate()
    {
        DraftReading reading = Draft.Read(culture);
        Outcome<Evaluation> outcome = Evaluator.Evaluate(reading.Spec);
        var unreadable = reading.Errors.Select(e => e.Field).ToHashSet();
        Errors = [.. reading.Errors, .. outcome.Errors.Where(e => !unreadable.Contains(e.Field))];
        _errors = Errors.GroupBy(e => e.Field).ToDictionary(g => g.Key, g => g.First().Message);
        Result = Errors.Count == 0 ? outcome.Value : null;
        Profile = Result is null ? [] : EvaluationProfile.Of(Result);
    }
}
