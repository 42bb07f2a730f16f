using System.Globalization;
using CapReview.Engine.CashFlows;
using CapReview.Engine.Rates;
using CapReview.Engine.Specifications;
using static CapReview.Web.Demo.DemoElements;
using CapReview.Reviews.Access;
using CapReview.Reviews.Cycles;
using CapReview.Reviews.Marr;
using CapReview.Reviews.Portfolio;
using CapReview.Reviews.Proposals;
using CapReview.Web.Identity;
using CapReview.Web.QuickEvaluation;

namespace CapReview.Web.Demo;

/// <summary>
/// The demo installation of Tarnby Components Ltd (an invented company): one user per role, a MARR policy per year,
/// last year's cycle decided with its signed packets (<see cref="DemoDecidedCycle"/>), and an open budget cycle with a
/// two-year plan, seven submitted proposals (two ways of renewing line 3, two of meeting the paint shop's emission
/// limit, a solar array and the battery that needs it) and one draft. Written once, into an empty database, in demo
/// mode only; the sign-ins are printed to the console every start in demo mode.
/// </summary>
public sealed partial class DemoScenario(IdentityStore identity, MarrPolicyService marr, CycleService cycles, ProposalService proposals,
    PortfolioRulesService rules, DemoDecidedCycle lastYear, ILogger<DemoScenario> log)
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
        Actor tove = actors["tove.berg@tarnby.example"], aino = actors["aino.salo@tarnby.example"];
        await lastYear.WriteAsync(admin, oskar, maren, tove, aino, cancellationToken).ConfigureAwait(false);

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
            ProposalCategory.Replacement, RiskClass.High, new ProposalAssumptions { Model = CncLine(), Replacement = CncLineTiming() }), cancellationToken).ConfigureAwait(false);
        await proposals.SubmitAsync(maren, cnc.Id, cycle.Id, cnc.Revision, cancellationToken).ConfigureAwait(false);

        async Task<ProposalView> SubmitAsync(Actor lead, string title, string description, ProposalCategory category, RiskClass risk, ModelSpec model, RiskSpec? uncertainty = null)
        {
            var draft = await proposals.CreateDraftAsync(lead, new ProposalDraft(title, description, category, risk,
                new ProposalAssumptions { Model = model, Risk = uncertainty }), cancellationToken).ConfigureAwait(false);
            return await proposals.SubmitAsync(lead, draft.Id, cycle.Id, draft.Revision, cancellationToken).ConfigureAwait(false);
        }
        var overhaul = await SubmitAsync(maren, "CNC line 3 overhaul",
            "Rebuild the spindles and controls of the two 2004 machining centres and keep them six more years.",
            ProposalCategory.Replacement, RiskClass.Standard, Model(6,
                Single("Spindle and control rebuild", CashFlowCategory.Capital, 0, -215_000),
                Uniform("Scrap and downtime avoided", CashFlowCategory.Revenue, 1, 6, 61_000),
                Uniform("Extra service visits", CashFlowCategory.Operating, 1, 6, -6_500),
                Single("Resale of the old centres", CashFlowCategory.Salvage, 6, 18_000)));
        var solar = await SubmitAsync(oskar, "Rooftop solar array, dispatch hall",
            "A 600 kWp array on the dispatch hall roof, built in two phases, selling surplus power at the feed-in tariff.",
            ProposalCategory.CostReduction, RiskClass.Low, Model(25,
                Single("Phase 1 array and inverters", CashFlowCategory.Capital, 0, -410_000),
                Single("Phase 2 array", CashFlowCategory.Capital, 1, -140_000),
                new() { Type = ElementKind.Geometric, Label = "Electricity not bought", Category = CashFlowCategory.Revenue, First = 1, Last = 25, Amount = 64_000, Growth = 0.02 },
                Uniform("Cleaning and inspection", CashFlowCategory.Operating, 1, 25, -5_500),
                new() { Type = ElementKind.Recurring, Label = "Inverter replacement", Category = CashFlowCategory.Capital, First = 12, Last = 12, Every = 12, Amount = -48_000 }),
            new RiskSpec
            {
                Trials = 10_000,
                Seed = 2027,
                Parameters =
                [
                    new ParameterSpec { Name = "Electricity not bought", Target = "elements[2].amount", Low = 50_000, MostLikely = 64_000, High = 72_000 },
                    new ParameterSpec { Name = "Electricity price growth", Target = "elements[2].growth", Low = 0.0, MostLikely = 0.02, High = 0.04, Distribution = Engine.Risk.DistributionKind.Pert },
                    new ParameterSpec { Name = "Phase 1 cost", Target = "elements[0].amount", Low = -460_000, MostLikely = -410_000, High = -395_000 },
                ],
            });
        var battery = await SubmitAsync(oskar, "Battery buffer for the solar array",
            "A 400 kWh battery that stores the array's midday surplus to cut the peak-demand charge.",
            ProposalCategory.CostReduction, RiskClass.Standard, Model(12,
                Single("Battery and controls", CashFlowCategory.Capital, 0, -96_000),
                Uniform("Peak-demand charge avoided", CashFlowCategory.Revenue, 1, 12, 17_500),
                Uniform("Service contract", CashFlowCategory.Operating, 1, 12, -1_800)));
        var extraction = await SubmitAsync(maren, "Paint shop extraction with carbon filters",
            "Meet the 2028 solvent-emission limit by filtering the paint booths' exhaust.",
            ProposalCategory.Compliance, RiskClass.Low, Model(15,
                Single("Extraction ducts and filter housings", CashFlowCategory.Capital, 0, -165_000),
                Uniform("Filter changes and fan power", CashFlowCategory.Operating, 1, 15, -14_000)));
        var waterBased = await SubmitAsync(maren, "Paint shop conversion to water-based paint",
            "Meet the 2028 solvent-emission limit by changing to water-based paint, with new booths and a drying tunnel.",
            ProposalCategory.Compliance, RiskClass.Standard, Model(15,
                Single("Booths and drying tunnel", CashFlowCategory.Capital, 0, -255_000),
                Uniform("Solvent and disposal no longer bought", CashFlowCategory.Revenue, 1, 15, 21_000),
                Uniform("Drying energy", CashFlowCategory.Operating, 1, 15, -9_000)));

        await rules.SaveGroupAsync(tove, cycle.Id, new GroupDraft("Line 3 capacity", false, [cnc.Id, overhaul.Id]), cancellationToken).ConfigureAwait(false);
        await rules.SaveGroupAsync(tove, cycle.Id, new GroupDraft("Paint shop emission limit", true, [extraction.Id, waterBased.Id]), cancellationToken).ConfigureAwait(false);
        await rules.AddContingencyAsync(tove, cycle.Id, battery.Id, solar.Id, cancellationToken).ConfigureAwait(false);
        await rules.SetPlanAsync(tove, cycle.Id, new CyclePlan(null, [250_000m], SelectionObjective.PresentWorth), cycle.Revision, cancellationToken).ConfigureAwait(false);

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
            new() { Type = ElementKind.Geometric, Label = "Labour and scrap saved", Category = CashFlowCategory.Revenue, First = 1, Last = 12, Amount = 137_000, Growth = 0.02 },
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

    /// <summary>The two 2004 centres in service and the five-axis centre, year by year (invented figures).</summary>
    private static ReplacementEstimates CncLineTiming() => new(
        DefenderValueNow: 70_000,
        Defender: [new(55_000, 140_000), new(42_000, 175_000), new(31_000, 205_000), new(22_000, 240_000)],
        Challenger:
        [
            new(560_000, 38_000), new(480_000, 41_000), new(415_000, 44_000), new(360_000, 48_000), new(312_000, 53_000), new(270_000, 59_000),
            new(232_000, 68_000), new(198_000, 80_000), new(168_000, 96_000), new(140_000, 116_000), new(115_000, 140_000), new(92_000, 168_000),
        ]);
}
