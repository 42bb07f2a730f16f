using System.Globalization;
using CapReview.Engine.CashFlows;
using CapReview.Engine.Rates;
using CapReview.Engine.Specifications;
using CapReview.Reviews.Access;
using CapReview.Reviews.Cycles;
using CapReview.Reviews.Marr;
using CapReview.Reviews.Proposals;
using CapReview.Web.Identity;
using CapReview.Web.QuickEvaluation;

namespace CapReview.Web.Demo;

/// <summary>
/// The demo installation of Tarnby Components Ltd (an invented company): one user per role, a MARR policy, an open
/// budget cycle and three proposals. Written once, into an empty database, in demo mode only; the sign-ins are
/// printed to the console every start in demo mode.
/// </summary>
public sealed partial class DemoScenario(IdentityStore identity, MarrPolicyService marr, CycleService cycles, ProposalService proposals, ILogger<DemoScenario> log)
{
    /// <summary>The demo's one password; demo mode only.</summary>
    public const string Password = "tarnby-demo-2027";

    public static IReadOnlyList<(string Email, string Name, string Role)> People { get; } =
    [
        ("ines.varga@tarnby.example", "Ines Varga", RoleNames.Administrator),
        ("oskar.lind@tarnby.example", "Oskar Lind", RoleNames.ProjectLead),
        ("maren.holt@tarnby.example", "Maren Holt", RoleNames.ProjectLead),
        ("tove.berg@tarnby.example", "Tove Berg", RoleNames.Reviewer),
        ("aino.salo@tarnby.example", "Aino Salo", RoleNames.Reviewer),
        ("rui.costa@tarnby.example", "Rui Costa", RoleNames.Finance),
    ];

    public async Task EnsureAsync(CancellationToken cancellationToken)
    {
        if (!await identity.AnyUserAsync(cancellationToken).ConfigureAwait(false))
        {
            await WriteAsync(cancellationToken).ConfigureAwait(false);
        }
        foreach (var (email, name, role) in People)
        {
            DemoSignIn(log, RoleNames.Describe(role), email, Password, name);
        }
    }

    private async Task WriteAsync(CancellationToken cancellationToken)
    {
        var actors = new Dictionary<string, Actor>();
        foreach (var (email, name, role) in People)
        {
            CapReviewUser user = await identity.CreateUserAsync(email, name, Password, [role]).ConfigureAwait(false);
            actors[email] = Actor.Of(user.Id, name, Enum.Parse<Role>(role));
        }
        Actor admin = actors["ines.varga@tarnby.example"], oskar = actors["oskar.lind@tarnby.example"], maren = actors["maren.holt@tarnby.example"];

        var policy = await marr.AddVersionAsync(admin, new NewMarrPolicy(0.09, RateBasis.Effective, 1, new DateOnly(2027, 1, 1),
            "Board resolution on the cost of capital for the 2027 plan", LowRiskPremium: -0.01, HighRiskPremium: 0.03), cancellationToken).ConfigureAwait(false);
        BudgetCycle cycle = await cycles.CreateAsync(admin, new NewBudgetCycle("Capital plan 2027", 1_500_000m, policy.Id,
            new DateOnly(2027, 1, 4), new DateOnly(2027, 3, 26)), cancellationToken).ConfigureAwait(false);

        var heat = await proposals.CreateDraftAsync(oskar, new ProposalDraft(
            "Compressor heat recovery, machining hall",
            "Recover the waste heat of the three screw compressors to heat the machining hall instead of burning gas.",
            ProposalCategory.CostReduction, RiskClass.Standard, new ProposalAssumptions { Model = HeatRecovery() }), cancellationToken).ConfigureAwait(false);
        await proposals.SubmitAsync(oskar, heat.Id, cycle.Id, heat.Revision, cancellationToken).ConfigureAwait(false);

        var cnc = await proposals.CreateDraftAsync(maren, new ProposalDraft(
            "CNC line 3 replacement",
            "Replace the two 2004 machining centres of line 3 with one five-axis centre and a pallet changer.",
            ProposalCategory.Replacement, RiskClass.High, new ProposalAssumptions { Model = CncLine() }), cancellationToken).ConfigureAwait(false);
        await proposals.SubmitAsync(maren, cnc.Id, cycle.Id, cnc.Revision, cancellationToken).ConfigureAwait(false);

        await proposals.CreateDraftAsync(oskar, new ProposalDraft(
            "Forklift fleet electrification",
            "Replace the six diesel forklifts of the dispatch yard with battery-electric trucks and a charging bay.",
            ProposalCategory.Replacement, RiskClass.Low, new ProposalAssumptions { Model = Forklifts() }), cancellationToken).ConfigureAwait(false);
        DemoWritten(log, cycle.Name, policy.Number);
    }

    [LoggerMessage(Level = LogLevel.Warning, Message = "Demo sign-in ({Role}): {Email} / {Password}  ({Name})")]
    private static partial void DemoSignIn(ILogger logger, string role, string email, string password, string name);

    [LoggerMessage(Level = LogLevel.Information, Message = "Demo data written: cycle {Cycle}, MARR policy version {Version}.")]
    private static partial void DemoWritten(ILogger logger, string cycle, int version);

    private static ModelSpec HeatRecovery() => ExampleModel.HeatRecoveryRetrofit().Read(CultureInfo.InvariantCulture).Spec with { Rate = null };

    private static ModelSpec CncLine() => new()
    {
        PeriodsPerYear = 1,
        Horizon = 12,
        Elements =
        [
            Single("Five-axis centre and pallet changer", CashFlowCategory.Capital, 0, -640_000),
            Single("Foundations and commissioning", CashFlowCategory.Capital, 0, -48_000),
            new() { Type = ElementKind.Geometric, Label = "Labour and scrap saved", Category = CashFlowCategory.Revenue, First = 1, Last = 12, Amount = 118_000, Growth = 0.02 },
            new() { Type = ElementKind.Arithmetic, Label = "Service contract", Category = CashFlowCategory.Operating, First = 1, Last = 12, Amount = -9_000, Step = -600 },
            new() { Type = ElementKind.Recurring, Label = "Spindle rebuild", Category = CashFlowCategory.Capital, First = 5, Last = 10, Every = 5, Amount = -45_000 },
            Single("Resale of the centre", CashFlowCategory.Salvage, 12, 60_000),
        ],
    };

    private static ModelSpec Forklifts() => new()
    {
        PeriodsPerYear = 1,
        Horizon = 10,
        Elements =
        [
            Single("Six battery-electric trucks", CashFlowCategory.Capital, 0, -186_000),
            Single("Charging bay", CashFlowCategory.Capital, 0, -24_000),
            new() { Type = ElementKind.Geometric, Label = "Diesel no longer bought", Category = CashFlowCategory.Revenue, First = 1, Last = 10, Amount = 52_000, Growth = 0.04 },
            new() { Type = ElementKind.Uniform, Label = "Electricity for charging", Category = CashFlowCategory.Operating, First = 1, Last = 10, Amount = -17_500 },
            Single("Battery replacement", CashFlowCategory.Capital, 6, -38_000),
            Single("Resale of the trucks", CashFlowCategory.Salvage, 10, 20_000),
        ],
    };

    private static ElementSpec Single(string label, CashFlowCategory category, int period, double amount) =>
        new() { Type = ElementKind.Single, Label = label, Category = category, Period = period, Amount = amount };
}
