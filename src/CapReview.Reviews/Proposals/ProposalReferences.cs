using CapReview.Reviews.Storage;
using Microsoft.EntityFrameworkCore;

namespace CapReview.Reviews.Proposals;

/// <summary>
/// A new proposal's reference: P- and its id in four digits, or the next free number after it when an imported
/// cycle already holds that reference (imports keep the references their decisions and packets cite).
/// </summary>
public static class ProposalReferences
{
    public static async Task<string> NextFreeAsync(CapReviewDbContext db, Proposal proposal, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(db);
        ArgumentNullException.ThrowIfNull(proposal);
        for (int n = proposal.Id; ; n++)
        {
            string reference = Of(n);
            if (!await db.Proposals.AnyAsync(p => p.Reference == reference && p.Id != proposal.Id, cancellationToken).ConfigureAwait(false))
            {
                return reference;
            }
        }
    }

    /// <summary>The first free reference from <paramref name="id"/> on, among references already known to be taken.</summary>
    public static string NextFree(int id, IReadOnlySet<string> taken)
    {
        ArgumentNullException.ThrowIfNull(taken);
        int n = id;
        while (taken.Contains(Of(n)))
        {
            n++;
        }
        return Of(n);
    }

    private static string Of(int n) => $"P-{n:D4}";
}
