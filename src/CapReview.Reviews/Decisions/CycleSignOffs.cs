using CapReview.Reviews.Interchange;

namespace CapReview.Reviews.Decisions;

/// <summary>
/// A cycle's sign-offs by what they count for. A sign-off covers exactly the decisions it lists: it counts towards the
/// cycle's required number only while that list is the cycle's whole present set of decisions. A later submission
/// or decision changes the set, so earlier sign-offs are <see cref="Superseded"/> (kept in the record, counted for
/// nothing) and their members sign again. Sign-offs imported from another installation's document are no act of
/// this installation's members and never count (<see cref="Imported"/>).
/// </summary>
/// <param name="Decisions">The set a sign-off given now covers.</param>
/// <param name="Current">Sign-offs of exactly that set, in order: the ones that count.</param>
/// <param name="Superseded">Sign-offs of an earlier set.</param>
/// <param name="Imported">Sign-offs copied from an imported document.</param>
public sealed record CycleSignOffs(IReadOnlyList<SignedDecision> Decisions, IReadOnlyList<SignOff> Current, IReadOnlyList<SignOff> Superseded, IReadOnlyList<SignOff> Imported)
{
    public static CycleSignOffs Of(IReadOnlyList<SignOff> signOffs, IReadOnlyList<SignedDecision> decisions)
    {
        ArgumentNullException.ThrowIfNull(signOffs);
        ArgumentNullException.ThrowIfNull(decisions);
        var imported = signOffs.Where(IsImported).ToList();
        var own = signOffs.Where(s => !IsImported(s)).ToList();
        var current = own.Where(s => SignedDecision.Parse(s.DecisionsSigned).SequenceEqual(decisions)).ToList();
        return new CycleSignOffs(decisions, current, [.. own.Except(current)], imported);
    }

    /// <summary>Whether this member's sign-off of the present set is already given.</summary>
    public bool HasSigned(string userId) => Current.Any(s => s.UserId == userId);

    private static bool IsImported(SignOff s) => CycleImporter.IsImported(s.UserId);
}
