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

    // A decided cycle is made here as an import would make it: the sample has no sign-off history to reach it by.
    public static readonly BudgetCycle Cycle = BudgetCycle.Imported(
        new NewBudgetCycle("Capital plan 2027", 1_500_000m, 1, new DateOnly(2027, 1, 4), new DateOnly(2027, 3, 26), 2),
        CycleStatus.Decided, null, [], Reviews.Portfolio.SelectionObjective.PresentWorth);

    public static readonly MarrPolicyVersion Marr = new(1,
        new NewMarrPolicy(0.09, RateBasis.Effective, 1, new DateOnly(2027, 1, 1), "Board resolution on the cost of capital", LowRiskPremium: -0.01, HighRiskPremium: 0.03),
        "admin-1", Now.AddMonths(-4));

    public static readonly SignOff[] SignOffs =
    [
        new(1, "board-1", "Tove Berg", Now.AddHours(-3), "[]"),
        new(1, "board-2", "Aino Salo", Now.AddHours(-1), "[]"),
    ];

    public static ModelSpec Model(double saving, int life = 12, Engine.Depreciation.OutlayClass? spindle = null) => new()
    {
        PeriodsPerYear = 1,
        Horizon = life,
        Elements =
        [
            new ElementSpec { Type = ElementKind.Single, Label = "Five-axis centre", Category = CashFlowCategory.Capital, Period = 0, Amount = -640_000 },
            new ElementSpec { Type = ElementKind.Geometric, Label = "Labour and scrap saved", Category = CashFlowCategory.Revenue, First = 1, Last = life, Amount = saving, Growth = 0.02 },
            new ElementSpec { Type = ElementKind.Arithmetic, Label = "Service contract", Category = CashFlowCategory.Operating, First = 1, Last = life, Amount = -9_000, Step = -600 },
            new ElementSpec { Type = ElementKind.Recurring, Label = "Spindle rebuild", Category = CashFlowCategory.Capital, First = 5, Last = 10, Every = 5, Amount = -45_000, DepreciatedAs = spindle },
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

    public static (ProposalView Proposal, Decision Decision) Decided(int id, DecisionOutcome outcome = DecisionOutcome.Approve, double saving = 137_000, TaxSpec? tax = null, RiskSpec? risk = null, Engine.Depreciation.OutlayClass? spindle = null)
    {
        var v1 = Version(1, Model(saving - 10_000), "First draft", frozen: true);
        var v2 = Version(2, Model(saving, spindle: spindle), "Savings re-estimated after the supplier's trial run", frozen: true, tax, risk);
        var proposal = new ProposalView(id, $"P-{id:D4}", "lead-1", id == 2 ? "CNC line 3 replacement" : $"Machining cell {id}", "Replace two machining centres.",
            ProposalCategory.Replacement, RiskClass.Standard, ProposalStatus.Approved, 1, 3, [v1, v2]);
        var decision = new Decision(id, 1, 2, v2.AssumptionsHash, 1, outcome,
            outcome == DecisionOutcome.Approve ? "Order before the March price rise" : "", "board-1", Now.AddDays(-2));
        return (proposal, decision);
    }

    public static ProposalPacketData ProposalData(PaperSize paper = PaperSize.A4, TaxSpec? tax = null, RiskSpec? risk = null, Engine.Depreciation.OutlayClass? spindle = null)
    {
        var (proposal, decision) = Decided(2, tax: tax, risk: risk, spindle: spindle);
        return new ProposalPacketData(Organisation, Cycle, Marr, proposal, decision, Figures(proposal, decision), SignOffs, Now, new SigningNotice("", "", true), paper);
    }

    public static CyclePacketData CycleData(int proposals)
    {
        var decided = Enumerable.Range(1, proposals).Select(k => Decided(k, k % 4 == 0 ? DecisionOutcome.Reject : DecisionOutcome.Approve, 100_000 + 1_500 * k)).ToList();
        return new(Organisation, Cycle, Marr, SignOffs, decided, decided.ToDictionary(d => d.Proposal.Id, d => Figures(d.Proposal, d.Decision)),
            null, Now, new SigningNotice("", "", true));
    }

    /// <summary>The figures the packet service gathers from the domain for a decided version.</summary>
    public static VersionFigures Figures(ProposalView proposal, Decision decision) =>
        VersionFigures.Of(proposal, proposal.Version(decision.VersionNumber), Marr, Cycle.StudyPeriodYears, simulate: true);

    /// <summary>A development certificate of the test run's own, in a temporary folder.</summary>
    public static PacketCertificate Certificate { get; } = PacketCertificate.Load(
        new PacketSigningOptions { DevelopmentCertificatePath = Path.Combine(Directory.CreateTempSubdirectory("capreview-packets-").FullName, "signing.pfx") },
        Organisation.Name);
}
