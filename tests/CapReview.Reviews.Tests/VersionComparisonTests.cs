using CapReview.Engine.Rates;
using CapReview.Reviews.Proposals;
using Microsoft.VisualBasic;
using static CapReview.Reviews.Tests.ReviewsDatabase;

namespace CapReview.Reviews.Tests;

public sealed class VersionComparisonTests(ReviewsDatabase db) : IClassFixture<ReviewsDatabase>
{
    [Fact]
    public async Task Lists_the_changed_fields_and_the_change_in_every_measure()
    {
        var cycle = await db.OpenCycleAsync("Compare 2027");
        var draft = await db.Proposals.CreateDraftAsync(Lead, Draft(), CancellationToken.None);
        var submitted = await db.Proposals.SubmitAsync(Lead, draft.Id, cycle.Id, draft.Revision, CancellationToken.None);
        var returned = await db.Proposals.TransitionAsync(Reviewer, draft.Id, ProposalStatus.ReturnedForChanges, submitted.Revision, CancellationToken.None);
        var revised = await db.Proposals.UpdateDraftAsync(Lead, draft.Id, returned.Revision, Draft(firstCost: -130_000, reason: "Higher quote"), CancellationToken.None);

        var difference = VersionComparison.Compare(revised.Versions[0], revised.Versions[1], AnnualRate.Effective(0.08));

        var change = Assert.Single(difference.Fields);
        Assert.Equal("model.elements[0].amount", change.Path);
        Assert.Equal(("-120000", "-130000"), (change.Before, change.After));
        // The same change in words, numbered as the editor numbers, with its effect on present worth: exactly −10,000 at period 0.
        var format = new CapReview.Reviews.Display.NumberDisplay(System.Globalization.CultureInfo.GetCultureInfo("en-IE"), "EUR");
        Assert.Equal("Element 1, ‘Chiller’: amount −120,000 → −130,000", change.Sentence(format));
        Assert.Equal(-10_000, change.PresentWorthEffect!.Value, 6);
        // The first cost is at period 0, so present worth falls by exactly 10,000 and annual worth by 10,000 (A/P, 8%, 10):
        // Microsoft.VisualBasic.Financial.Pmt gives the capital-recovery factor.
        var pw = difference.Measures.Single(m => m.Measure == "Present worth");
        Assert.Equal(-10_000, pw.Change!.Value, 6);
        var aw = difference.Measures.Single(m => m.Measure == "Annual worth");
        Assert.Equal(-10_000 * Financial.Pmt(0.08, 10, -1), aw.Change!.Value, 6);
        Assert.True(difference.Measures.Single(m => m.Measure == "Rate of return").Change < 0);
    }
}
