using CapReview.Reviews.Audit;
using CapReview.Reviews.Comments;
using CapReview.Reviews.Decisions;
using CapReview.Reviews.Marr;
using CapReview.Reviews.Proposals;
using CapReview.Reviews.Records;
using Microsoft.EntityFrameworkCore;
using static CapReview.Reviews.Tests.ReviewsDatabase;

namespace CapReview.Reviews.Tests;

/// <summary>
/// One row of each kind that is written once, made through the services (the packet stored directly: the packet
/// service lives in another project), with the value a test tries to change and what it must stay.
/// </summary>
internal sealed record WrittenOnceRows(IReadOnlyDictionary<string, WrittenOnceRow> ByTable)
{
    public const string Conditions = "Order before the March price rise";

    /// <summary>The tables the database's triggers guard; comments are guarded by the entities and the interceptor only.</summary>
    public static readonly string[] TriggerTables = ["proposal_version", "decision", "sign_off", "marr_policy_version", "audit_event", "approval_packet"];

    public WrittenOnceRow this[string table] => ByTable[table];

    public static async Task<WrittenOnceRows> CreateAsync(ReviewsDatabase db, string name)
    {
        var none = CancellationToken.None;
        var cycle = await db.OpenCycleAsync(name);
        var draft = await db.Proposals.CreateDraftAsync(Lead, Draft(), none);
        var submitted = await db.Proposals.SubmitAsync(Lead, draft.Id, cycle.Id, draft.Revision, none);
        await db.Comments.AddAsync(Reviewer, draft.Id, "Is the electricity price escalated?", none);
        var decision = await db.Decisions.DecideAsync(Reviewer, draft.Id, DecisionOutcome.Approve, Conditions, submitted.Revision, none);
        var signed = await db.Decisions.SignOffAsync(Reviewer, cycle.Id, none);
        await using var context = db.NewContext();
        var packet = ApprovalPacket.Made(new PacketRecord(PacketKind.Cycle, cycle.Id, null, null, null, cycle.MarrPolicyVersionId), "cycle.pdf",
            [0x25, 0x50, 0x44, 0x46], DateTimeOffset.UnixEpoch, new SigningCertificate("CN=Test", new string('b', 40), Development: true));
        context.ApprovalPackets.Add(packet);
        await context.SaveChangesAsync();
        int versionId = await context.ProposalVersions.Where(v => v.ProposalId == draft.Id).Select(v => v.Id).SingleAsync();
        int commentId = await context.Comments.Where(c => c.ProposalId == draft.Id).Select(c => c.Id).SingleAsync();
        var audit = await context.AuditEvents.OrderBy(e => e.Id).Where(e => e.Action == "proposal.submitted" && e.EntityId == draft.Reference).SingleAsync();
        var marr = await context.MarrPolicyVersions.SingleAsync(m => m.Id == cycle.MarrPolicyVersionId);
        return new WrittenOnceRows(new Dictionary<string, WrittenOnceRow>
        {
            ["proposal_version"] = new(typeof(ProposalVersion), versionId, nameof(ProposalVersion.Reason), "First draft"),
            ["decision"] = new(typeof(Decision), decision.Id, nameof(Decision.Conditions), Conditions),
            ["sign_off"] = new(typeof(SignOff), signed.Id, nameof(SignOff.DisplayName), "Tove Board"),
            ["marr_policy_version"] = new(typeof(MarrPolicyVersion), marr.Id, nameof(MarrPolicyVersion.Reason), "Test policy"),
            ["audit_event"] = new(typeof(AuditEvent), audit.Id, nameof(AuditEvent.UserId), Lead.UserId),
            ["approval_packet"] = new(typeof(ApprovalPacket), packet.Id, nameof(ApprovalPacket.FileName), "cycle.pdf"),
            ["proposal_comment"] = new(typeof(ProposalComment), commentId, nameof(ProposalComment.Text), "Is the electricity price escalated?"),
        });
    }
}
