using System.Text.Json;
using CapReview.Reviews.Proposals;

namespace CapReview.Reviews.Decisions;

/// <summary>
/// One decision as a sign-off covers it: the proposal's reference, the version judged, the SHA-256 of its assumptions
/// and the outcome. A sign-off stores the whole set it covered (<see cref="SignOff.DecisionsSigned"/>) in this shape.
/// </summary>
public sealed record SignedDecision(string Proposal, int Version, string AssumptionsHash, string Outcome)
{
    /// <summary>
    /// The set a sign-off given now would cover: each proposal's latest decision, by reference, when it was made on the
    /// version the board has now (<paramref name="underReview"/>: the last frozen version of each proposal). A revision
    /// resubmitted after a decision leaves that decision standing for nothing, so the set changes and the sign-offs of
    /// the earlier set are superseded.
    /// </summary>
    internal static IReadOnlyList<SignedDecision> SetOf(IEnumerable<Proposal> proposals, IEnumerable<Decision> decisions, IReadOnlyDictionary<int, int> underReview)
    {
        var references = proposals.ToDictionary(p => p.Id, p => p.Reference);
        return [.. decisions.Where(d => references.ContainsKey(d.ProposalId) && underReview.TryGetValue(d.ProposalId, out int version) && version == d.VersionNumber)
            .GroupBy(d => d.ProposalId)
            .Select(g => g.OrderBy(d => d.Id).Last())
            .Select(d => new SignedDecision(references[d.ProposalId], d.VersionNumber, d.AssumptionsHash, d.Outcome.ToString()))
            .OrderBy(d => d.Proposal, StringComparer.Ordinal)];
    }

    /// <summary>The set as a sign-off stores it (the names as written here, the outcome's enum name).</summary>
    internal static string Serialize(IReadOnlyList<SignedDecision> set) => JsonSerializer.Serialize(set);

    /// <summary>The set a sign-off stored; empty when it stored none or something unreadable (it then covers nothing).</summary>
    public static IReadOnlyList<SignedDecision> Parse(string decisionsSigned)
    {
        try
        {
            return JsonSerializer.Deserialize<List<SignedDecision>>(decisionsSigned) ?? [];
        }
        catch (JsonException)
        {
            return [];
        }
    }
}
