using CapReview.Engine.Rates;
using CapReview.Reviews.Common;
using CapReview.Reviews.Cycles;
using CapReview.Reviews.Marr;
using CapReview.Reviews.Proposals;
using Microsoft.EntityFrameworkCore;
using static CapReview.Reviews.Tests.ReviewsDatabase;

namespace CapReview.Reviews.Tests;

public sealed class MarrAndCycleTests(ReviewsDatabase db) : IClassFixture<ReviewsDatabase>
{
    private static readonly CancellationToken None = CancellationToken.None;

    [Fact]
    public async Task A_new_policy_version_never_changes_a_cycle_pinned_to_an_older_one()
    {
        var cycle = await db.OpenCycleAsync("Pinned 2027");
        var newer = await db.Marr.AddVersionAsync(Admin, new NewMarrPolicy(0.11, RateBasis.Effective, 1, new DateOnly(2027, 6, 1), "Cost of capital rose"), None);
        var cycles = await db.Cycles.ListAsync(None);
        var pinned = cycles.Single(c => c.Id == cycle.Id);
        Assert.Equal(cycle.MarrPolicyVersionId, pinned.MarrPolicyVersionId);
        Assert.NotEqual(newer.Id, pinned.MarrPolicyVersionId);
        var versions = await db.Marr.ListAsync(None);
        Assert.Equal(0.08, versions.Single(v => v.Id == pinned.MarrPolicyVersionId).Rate);
    }

    [Fact]
    public async Task Policy_versions_are_numbered_and_cannot_be_edited()
    {
        var a = await db.Marr.AddVersionAsync(Admin, new NewMarrPolicy(0.09, RateBasis.Nominal, 12, new DateOnly(2027, 1, 1), "Monthly quoting"), None);
        var b = await db.Marr.AddVersionAsync(Admin, new NewMarrPolicy(0.095, RateBasis.Effective, 1, new DateOnly(2027, 2, 1), "Annual quoting"), None);
        Assert.Equal(a.Number + 1, b.Number);
        await using var context = db.NewContext();
        var stored = await context.MarrPolicyVersions.SingleAsync(m => m.Id == a.Id);
        context.Entry(stored).Property(m => m.Rate).CurrentValue = 0.5;
        Assert.Throws<RuleViolationException>(() => context.SaveChanges());
    }

    [Fact]
    public void Risk_premiums_add_to_the_effective_base_rate()
    {
        var policy = new MarrPolicyVersion(1, new NewMarrPolicy(0.12, RateBasis.Nominal, 12, new DateOnly(2027, 1, 1), "b", HighRiskPremium: 0.03), "a", default);
        // (1.01)^12 − 1 = 12.6825% effective, plus 3 points for high risk (common practice, no source).
        Assert.Equal(Math.Pow(1.01, 12) - 1 + 0.03, policy.RateFor(RiskClass.High).EffectiveAnnual(), 12);
        Assert.Equal(RateBasis.Nominal, policy.RateFor(RiskClass.Standard).Basis);
    }

    [Theory]
    [InlineData(double.NaN, "finite")]
    [InlineData(-1.5, "above -100%")]
    public async Task A_bad_policy_rate_is_refused_with_its_reason(double rate, string message)
    {
        var error = await Assert.ThrowsAsync<RuleViolationException>(() =>
            db.Marr.AddVersionAsync(Admin, new NewMarrPolicy(rate, RateBasis.Effective, 1, new DateOnly(2027, 1, 1), "x"), None));
        Assert.Contains(message, error.Message);
    }

    [Fact]
    public async Task Only_administrators_set_the_policy_and_open_cycles()
    {
        await Assert.ThrowsAsync<AccessDeniedException>(() =>
            db.Marr.AddVersionAsync(Lead, new NewMarrPolicy(0.08, RateBasis.Effective, 1, new DateOnly(2027, 1, 1), "x"), None));
        await Assert.ThrowsAsync<AccessDeniedException>(() =>
            db.Cycles.CreateAsync(Reviewer, new NewBudgetCycle("x", 1m, 1, new DateOnly(2027, 1, 1), new DateOnly(2027, 2, 1)), None));
    }

    [Theory]
    [InlineData("", 1000, 1, 2, "name")]
    [InlineData("Bad limit", 0, 1, 2, "capital limit")]
    [InlineData("Bad dates", 1000, 1, -5, "closes before it opens")]
    public async Task Cycle_input_is_checked(string name, int limit, int marr, int closesAfterDays, string message)
    {
        var opens = new DateOnly(2027, 1, 10);
        var error = await Assert.ThrowsAsync<RuleViolationException>(() =>
            db.Cycles.CreateAsync(Admin, new NewBudgetCycle(name, limit, marr, opens, opens.AddDays(closesAfterDays)), None));
        Assert.Contains(message, error.Message);
    }
    [Theory]
    [InlineData(-0.39, -0.5, 0.0, "lowRiskPremium")]
    [InlineData(-0.3, 0.0, -0.11, "standardRiskPremium")]
    public async Task A_premium_that_takes_a_risk_class_below_the_minus_40_percent_bound_is_refused_and_nothing_is_stored(double rate, double low, double standard, string field)
    {
        int before = (await db.Marr.ListAsync(None)).Count;
        var error = await Assert.ThrowsAsync<RuleViolationException>(() => db.Marr.AddVersionAsync(Admin,
            new NewMarrPolicy(rate, RateBasis.Effective, 1, new DateOnly(2029, 1, 1), "Deflation scenario", LowRiskPremium: low, StandardRiskPremium: standard), None));
        Assert.Equal(field, error.Field);
        Assert.DoesNotContain(field, error.Message, StringComparison.Ordinal);
        Assert.Equal(before, (await db.Marr.ListAsync(None)).Count);
    }
}

