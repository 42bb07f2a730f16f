namespace CapReview.Reviews.Audit;

/// <summary>
/// What an audit event records, in words ("Decision recorded"), for the trail's page and its CSV; the stored action
/// (<c>decision.recorded</c>) stays the machine's name, in the API and the hash chain.
/// </summary>
public static class AuditWording
{
    private static readonly Dictionary<string, string> Words = new(StringComparer.Ordinal)
    {
        ["audit.keyed"] = "Audit trail sealed with a key",
        ["comment.added"] = "Comment added",
        ["cycle.contingency-added"] = "Contingency added",
        ["cycle.contingency-removed"] = "Contingency removed",
        ["cycle.corrected"] = "Cycle's dates or limit corrected",
        ["cycle.created"] = "Cycle opened",
        ["cycle.group-removed"] = "Group removed",
        ["cycle.group-saved"] = "Group saved",
        ["cycle.imported"] = "Cycle imported",
        ["cycle.moved"] = "Cycle moved on",
        ["cycle.plan-changed"] = "Cycle's plan changed",
        ["cycle.signed-off"] = "Cycle signed off",
        ["decision.recorded"] = "Decision recorded",
        ["marr.version-added"] = "MARR version added",
        ["marr.version-retired"] = "MARR version retired",
        ["packet.downloaded"] = "Packet downloaded",
        ["packet.stored"] = "Packet stored",
        ["packets.requested"] = "Packets requested",
        ["proposal.created"] = "Proposal created",
        ["proposal.edited"] = "Proposal edited",
        ["proposal.resubmitted"] = "Revision resubmitted",
        ["proposal.revision-started"] = "Revision started under review",
        ["proposal.submitted"] = "Proposal submitted",
        ["proposal.inreview"] = "Proposal taken into review",
        ["proposal.approved"] = "Proposal approved",
        ["proposal.returnedforchanges"] = "Proposal returned for changes",
        ["proposal.rejected"] = "Proposal rejected",
        ["proposal.withdrawn"] = "Proposal withdrawn",
        ["user.created"] = "Account created",
        ["user.disabled"] = "Account disabled",
        ["user.enabled"] = "Account enabled",
        ["user.password-reset"] = "Password reset",
        ["user.roles-changed"] = "Roles changed",
        ["user.sessions-ended"] = "Sessions ended",
        ["user.two-step-reset"] = "Two-step sign-in reset",
    };

    /// <summary>The words for <paramref name="action"/>; an action without its own words reads from its parts ("token.revoked" → "Token revoked").</summary>
    public static string Of(string action)
    {
        ArgumentNullException.ThrowIfNull(action);
        if (Words.TryGetValue(action, out string? words))
        {
            return words;
        }
        string spaced = action.Replace('.', ' ').Replace('-', ' ').Replace('_', ' ').Trim();
        return spaced.Length == 0 ? "Event" : char.ToUpperInvariant(spaced[0]) + spaced[1..];
    }
}
