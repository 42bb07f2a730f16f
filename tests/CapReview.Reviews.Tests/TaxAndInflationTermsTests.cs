using CapReview.Engine.Evaluation;
using CapReview.Engine.Inflation;
using CapReview.Engine.Rates;
using CapReview.Engine.Specifications;
using CapReview.Reviews.Marr;
using CapReview.Reviews.Proposals;
using Microsoft.VisualBasic;
using static CapReview.Reviews.Tests.ReviewsDatabase;

namespace CapReview.Reviews.Tests;

public sealed class TaxAndInflationTermsTests(ReviewsDatabase db) : IClassFixture<ReviewsDatabase>
{
    private static readonly CancellationToken None = CancellationToken.None;

    private static readonly TaxSpec Tax = new()
    {
        IncomeTaxRate = 0.25,
        Depreciation = new DepreciationSpec { Method = DepreciationMethod.StraightLine, Life = 10 },
    };

    [Fact]
    public async Task The_after_tax_ranking_uses_the_after_tax_flows_and_leaves_out_proposals_without_tax_settings()
    {
        var cycle = await db.OpenCycleAsync("After tax 2027");
        var plain = Draft("Untaxed chiller");
        var taxed = Draft("Taxed chiller");
        var withTax = await db.Proposals.CreateDraftAsync(Lead, taxed with { Assumptions = taxed.Assumptions with { Tax = Tax } }, None);
        var without = await db.Proposals.CreateDraftAsync(Lead, plain, None);
        await db.Proposals.SubmitAsync(Lead, withTax.Id, cycle.Id, withTax.Revision, None);
        await db.Proposals.SubmitAsync(Lead, without.Id, cycle.Id, without.Revision, None);

        var ranking = await db.Rankings.RankAsync(Reviewer, cycle.Id, 0, None, afterTax: true);
        Assert.True(ranking.AfterTax);
        Assert.StartsWith("after-tax", ranking.Basis);
        var row = Assert.Single(ranking.Rows);
        Assert.Equal(withTax.Reference, row.Proposal.Reference);
        Assert.Contains("no tax settings", Assert.Single(ranking.Unranked).Reason);
        // Hand computation: 120,000 written off over 10 years; 24,000 − 12,000 taxable, 3,000 tax: 21,000 a year after
        // tax, at the after-tax MARR of 8 % × 0.75 = 6 %. Outside reference: Microsoft.VisualBasic.Financial.PV.
        Assert.Equal(-120_000 - Financial.PV(0.06, 10, 21_000), row.Ranked.PresentWorth, 6);
        Assert.Equal(120_000, row.Ranked.FirstCost);
    }

    [Fact]
    public async Task The_policys_inflation_and_real_MARR_apply_to_amounts_in_constant_money()
    {
        var policy = await db.Marr.AddVersionAsync(Admin, new NewMarrPolicy(0.05, RateBasis.Effective, 1, new DateOnly(2027, 1, 1), "Real MARR", InflationRate: 0.03, RealMarr: true), None);
        var draft = Draft("Chiller in today's money");
        var model = draft.Assumptions.Model with
        {
            Elements = [draft.Assumptions.Model.Elements![0], draft.Assumptions.Model.Elements[1]! with { Money = MoneyBasis.Constant }],
        };
        var assumptions = draft.Assumptions with { Model = model };
        // Outside reference: Microsoft.VisualBasic.Financial.PV of the real savings at the real 5 %.
        Evaluation evaluation = VersionComparison.Evaluate(assumptions, policy, RiskClass.Standard)!;
        Assert.Equal(-120_000 - Financial.PV(0.05, 10, 24_000), evaluation.PresentWorth, 6);
        Assert.Equal(1.05 * 1.03 - 1, evaluation.Marr.EffectiveAnnual(), 12);
        Assert.Contains("\"inflationRate\":\"0.03\"", MarrPolicyDocument.Serialize(policy));
    }

    [Fact]
    public void A_policy_without_inflation_keeps_the_canonical_form_it_had_before_inflation_existed()
    {
        var policy = new MarrPolicyVersion(1, new NewMarrPolicy(0.09, RateBasis.Effective, 1, new DateOnly(2027, 1, 1), "r"), "a", default);
        Assert.DoesNotContain("inflation", MarrPolicyDocument.Serialize(policy));
        Assert.Equal("""{"number":1,"rate":"0.09","basis":"Effective","compoundingsPerYear":1,"effectiveFrom":"2027-01-01","lowRiskPremium":"0","standardRiskPremium":"0","highRiskPremium":"0","setBy":"a","reason":"r"}""",
            MarrPolicyDocument.Serialize(policy));
    }
}
