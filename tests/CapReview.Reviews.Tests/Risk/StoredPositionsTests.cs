using CapReview.Engine.Risk;
using CapReview.Reviews.Proposals;
using CapReview.Reviews.Risk;
using Microsoft.EntityFrameworkCore;
using static CapReview.Reviews.Tests.ReviewsDatabase;

namespace CapReview.Reviews.Tests.Risk;

/// <summary>A version stored before element identities: frozen, it keeps its text and hash; edited, it takes identities.</summary>
public sealed class StoredPositionsTests(ReviewsDatabase db) : IClassFixture<ReviewsDatabase>
{
    private static readonly CancellationToken None = CancellationToken.None;

    // Canonical JSON as written before identities: the risk parameter names the saving (element 1) by position.
    private const string Legacy = """{"model":{"periodsPerYear":1,"horizon":10,"elements":[{"type":"single","label":"Plant","category":"capital","period":0,"amount":-400000},{"type":"uniform","label":"Saving","category":"revenue","first":1,"last":10,"amount":70000}]},"risk":{"parameters":[{"name":"Saving","target":"elements[1].amount","low":50000,"mostLikely":70000,"high":90000}],"trials":1000,"seed":3}}""";

    /// <summary>SHA-256 of the UTF-8 text, computed here with System.Security.Cryptography (outside reference).</summary>
    private static string Sha256(string text) => Convert.ToHexStringLower(System.Security.Cryptography.SHA256.HashData(System.Text.Encoding.UTF8.GetBytes(text)));

    [Fact]
    public async Task A_frozen_positional_version_keeps_its_text_and_hash_and_the_next_version_names_elements_by_identity()
    {
        var cycle = await db.OpenCycleAsync($"Stored positions {Guid.NewGuid():N}");
        var draft = await db.Proposals.CreateDraftAsync(Lead, Draft("Kiln heat recovery"), None);
        await using (var context = db.NewContext())
        {
            // Test arrangement: the draft as an older release stored it.
            var version = await context.Set<ProposalVersion>().SingleAsync(v => v.ProposalId == draft.Id);
            context.Entry(version).Property(v => v.AssumptionsJson).CurrentValue = Legacy;
            context.Entry(version).Property(v => v.AssumptionsHash).CurrentValue = Sha256(Legacy);
            await context.SaveChangesAsync();
        }
        draft = await db.Proposals.GetAsync(Lead, draft.Id, None);
        await db.Proposals.SubmitAsync(Lead, draft.Id, cycle.Id, draft.Revision, None);
        await using (var context = db.NewContext())
        {
            var proposal = await context.Proposals.SingleAsync(p => p.Id == draft.Id);
            context.Entry(proposal).Property(p => p.Status).CurrentValue = ProposalStatus.ReturnedForChanges;
            await context.SaveChangesAsync();
        }
        var returned = await db.Proposals.GetAsync(Lead, draft.Id, None);
        var frozen = Assert.Single(returned.Versions);
        Assert.Equal("elements[1].amount", frozen.Assumptions.Risk!.Parameters![0]!.Target);

        // Saved unchanged from the editor, which stamps what it loads: no change, so no new version and no reason needed.
        var stamped = ElementIdentities.Stamp(frozen.Assumptions);
        var saved = await db.Proposals.UpdateDraftAsync(Lead, draft.Id, returned.Revision, Draft("Kiln heat recovery") with { Assumptions = stamped }, None);
        Assert.Single(saved.Versions);

        // Reordered and saved with a reason: a new version naming the saving by identity; the frozen one is as it was.
        var reordered = stamped with { Model = stamped.Model with { Elements = [.. stamped.Model.Elements!.Reverse()] } };
        var next = await db.Proposals.UpdateDraftAsync(Lead, draft.Id, saved.Revision, Draft("Kiln heat recovery", reason: "Saving listed first") with { Assumptions = reordered }, None);
        Assert.Equal(2, next.Versions.Count);
        Assert.Equal("elements[#e2].amount", next.Latest.Assumptions.Risk!.Parameters![0]!.Target);
        await using (var context = db.NewContext())
        {
            var first = await context.Set<ProposalVersion>().SingleAsync(v => v.ProposalId == draft.Id && v.Number == 1);
            Assert.Equal(Legacy, first.AssumptionsJson);
            Assert.Equal(Sha256(Legacy), first.AssumptionsHash);
        }

        // Both versions vary the saving: a swing of 40,000 × (P/A, 10 %, 10) at a 10 % MARR (standard factor).
        double expected = 40_000 * (1 - Math.Pow(1.1, -10)) / 0.1;
        foreach (var version in next.Versions)
        {
            var model = version.Assumptions.Model with { Rate = new Engine.Specifications.RateSpec { Value = 0.10 } };
            var study = ProposalRisk.Prepare(new ProposalCase(model), version.Assumptions.Risk!).Value!;
            Assert.Equal(expected, Assert.Single(ProposalRisk.Analyse(study).Tornado).Swing, 6);
        }
    }
}
