using System.Globalization;
using CapReview.Engine.CashFlows;
using CapReview.Engine.Rates;
using CapReview.Engine.Specifications;
using CapReview.Packets.Content;
using CapReview.Packets.Layout;
using CapReview.Packets.Signing;
using CapReview.Reviews.Cycles;
using CapReview.Reviews.Decisions;
using CapReview.Reviews.Marr;
using CapReview.Reviews.Proposals;

namespace CapReview.Packets.Tests;

/// <summary>Invented packet contents: a decided cycle of an invented company, with as many proposals as a test needs.</summary>
internal static class PacketSamples
{
    public static readonly PacketOrganisation Organisation = new("Tarnby Components Ltd", "EUR", CultureInfo.GetCultureInfo("en-IE"));
    public static readonly DateTimeOffset Now = new(2027, 3, 30, 14, 5, 0, TimeSpan.Zero);

    public static readonly BudgetCycle Cycle = new()
    {
        Id = 1, Name = "Capital plan 2027", CapitalLimit = 1_500_000m, MarrPolicyVersionId = 1, OpensOn = new DateOnly(2027, 1, 4),
        ClosesOn = new DateOnly(2027, 3, 26), Status = CycleStatus.Decided, RequiredSignOffs = 2,
    };

    public static readonly MarrPolicyVersion Marr = new()
    {
        Id = 1, Number = 1, Rate = 0.09, Basis = RateBasis.Effective, EffectiveFrom = new DateOnly(2027, 1, 1), LowRiskPremium = -0.01,
        HighRiskPremium = 0.03, SetBy = "admin-1", Reason = "Board resolution on the cost of capital", CreatedAt = Now.AddMonths(-4),
    };

    public static readonly SignOff[] SignOffs =
    [
        new() { Id = 1, BudgetCycleId = 1, UserId = "board-1", DisplayName = "Tove Berg", SignedAt = Now.AddHours(-3), DecisionsSigned = "[]" },
        new() { Id = 2, BudgetCycleId = 1, UserId = "board-2", DisplayName = "Aino Salo", SignedAt = Now.AddHours(-1), DecisionsSigned = "[]" },
    ];

    public static ModelSpec Model(double saving, int life = 12) => new()
    {
        PeriodsPerYear = 1,
        Horizon = life,
        Elements =
        [
            new ElementSpec { Type = ElementKind.Single, Label = "Five-axis centre", Category = CashFlowCategory.Capital, Period = 0, Amount = -640_000 },
            new ElementSpec { Type = ElementKind.Geometric, Label = "Labour and scrap saved", Category = CashFlowCategory.Revenue, First = 1, Last = life, Amount = saving, Growth = 0.02 },
            new ElementSpec { Type = ElementKind.Arithmetic, Label = "Service contract", Category = CashFlowCategory.Operating, First = 1, Last = life, Amount = -9_000, Step = -600 },
            new ElementSpec { Type = ElementKind.Recurring, Label = "Spindle rebuild", Category = CashFlowCategory.Capital, First = 5, Last = 10, Every = 5, Amount = -45_000 },
            new ElementSpec { Type = ElementKind.Single, Label = "Resale of the centre", Category = CashFlowCategory.Salvage, Period = life, Amount = 60_000 },
        ],
    };

    public static VersionView Version(int number, ModelSpec model, string reason, bool frozen, TaxSpec? tax = null, RiskSpec? risk = null)
    {
        var assumptions = new ProposalAssumptions { Model = model, Tax = tax, Risk = risk };
        string json = AssumptionsDocument.Serialize(assumptions);
        return new VersionView(number, "lead-1", Now.AddDays(-60 + number), reason, frozen, frozen ? Now.AddDays(-59 + number) : null,
            AssumptionsDocument.Hash(json), assumptions);
    }

    public static (ProposalView Proposal, Decision Decision) Decided(int id, DecisionOutcome outcome = DecisionOutcome.Approve, double saving = 137_000, TaxSpec? tax = null, RiskSpec? risk = null)
    {
        var v1 = Version(1, Model(saving - 10_000), "First draft", frozen: true);
        var v2 = Version(2, Model(saving), "Savings re-estimated after the supplier's trial run", frozen: true, tax, risk);
        var proposal = new ProposalView(id, $"P-{id:D4}", "lead-1", id == 2 ? "CNC line 3 replacement" : $"Machining cell {id}", "Replace two machining centres.",
            ProposalCategory.Replacement, RiskClass.Standard, ProposalStatus.Approved, 1, 3, [v1, v2]);
        var decision = new Decision
        {
            Id = id, ProposalId = id, BudgetCycleId = 1, VersionNumber = 2, AssumptionsHash = v2.AssumptionsHash, MarrPolicyVersionId = 1,
            Outcome = outcome, Conditions = outcome == DecisionOutcome.Approve ? "Order before the March price rise" : "", DecidedBy = "board-1", DecidedAt = Now.AddDays(-2),
        };
        return (proposal, decision);
    }

    public static ProposalPacketData ProposalData(PaperSize paper = PaperSize.A4, TaxSpec? tax = null, RiskSpec? risk = null)
    {
        var (proposal, decision) = Decided(2, tax: tax, risk: risk);
        return new ProposalPacketData(Organisation, Cycle, Marr, proposal, decision, SignOffs, Now, new SigningNotice("", "", true), paper);
    }

    public static CyclePacketData CycleData(int proposals) =>
        new(Organisation, Cycle, Marr, SignOffs,
            [.. Enumerable.Range(1, proposals).Select(k => Decided(k, k % 4 == 0 ? DecisionOutcome.Reject : DecisionOutcome.Approve, 100_000 + 1_500 * k))],
            null, Now, new SigningNotice("", "", true));

    /// <summary>A development certificate of the test run's own, in a temporary folder.</summary>
    public static PacketCertificate Certificate { get; } = PacketCertificate.Load(
        new PacketSigningOptions { DevelopmentCertificatePath = Path.Combine(Directory.CreateTempSubdirectory("capreview-packets-").FullName, "signing.pfx") },
        Organisation.Name);
}
