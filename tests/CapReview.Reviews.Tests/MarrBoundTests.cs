using CapReview.Engine.Rates;
using CapReview.Reviews.Common;
using CapReview.Reviews.Marr;
using static CapReview.Reviews.Tests.ReviewsDatabase;

namespace CapReview.Reviews.Tests;

/// <summary>The −40% bound of docs/methods.md ("Limits of the input") wherever a MARR is entered: the policy and its premiums.</summary>
public sealed class MarrBoundTests(ReviewsDatabase db) : IClassFixture<ReviewsDatabase>
{
    private static NewMarrPolicy Policy(double rate, double highPremium = 0) => new(rate, RateBasis.Effective, 1, new DateOnly(2027, 1, 1), "Bound test", HighRiskPremium: highPremium);

    [Fact]
    public async Task A_policy_below_minus_40_percent_is_refused_naming_the_rate()
    {
        var refused = await Assert.ThrowsAsync<RuleViolationException>(() => db.Marr.AddVersionAsync(Admin, Policy(-0.41), CancellationToken.None));
        Assert.StartsWith("MARR: The rate must be at least −40% a year", refused.Message, StringComparison.Ordinal);
        Assert.Equal("rate.value", refused.Field);
        Assert.Equal(-0.4, (await db.Marr.AddVersionAsync(Admin, Policy(-0.4), CancellationToken.None)).Rate);
    }

    [Fact]
    public async Task A_premium_that_takes_a_class_below_the_bound_is_refused_naming_it()
    {
        var refused = await Assert.ThrowsAsync<RuleViolationException>(() => db.Marr.AddVersionAsync(Admin, Policy(-0.3, highPremium: -0.2), CancellationToken.None));
        Assert.StartsWith("High-risk premium: with this premium the MARR of high-risk proposals would be -50 %", refused.Message, StringComparison.Ordinal);
    }
}
