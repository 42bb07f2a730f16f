using CapReview.Engine.CashFlows;
using CapReview.Engine.Specifications;
using CapReview.Reviews.Access;
using CapReview.Reviews.Cycles;
using CapReview.Reviews.Decisions;
using CapReview.Reviews.Marr;
using CapReview.Reviews.Organisation;
using CapReview.Reviews.Proposals;
using CapReview.Reviews.Storage;
using Microsoft.EntityFrameworkCore;
using Microsoft.Extensions.DependencyInjection;

namespace CapReview.Reviews.Tests;

/// <summary>The domain services on a real, migrated database of their own (no in-memory provider): a SQLite file, or PostgreSQL (<see cref="CapReview.TestSupport.TestDatabase"/>).</summary>
public sealed class ReviewsDatabase : IAsyncLifetime
{
    private readonly string _folder = Directory.CreateTempSubdirectory("capreview-reviews-").FullName;
    private ServiceProvider _services = null!;

    public static readonly Actor Admin = Actor.Of("admin-1", "Ines Admin", Role.Administrator);
    public static readonly Actor Lead = Actor.Of("lead-1", "Oskar Lead", Role.ProjectLead);
    public static readonly Actor OtherLead = Actor.Of("lead-2", "Maren Lead", Role.ProjectLead);
    public static readonly Actor Reviewer = Actor.Of("board-1", "Tove Board", Role.Reviewer);
    public static readonly Actor SecondReviewer = Actor.Of("board-2", "Aino Board", Role.Reviewer);
    public static readonly Actor Finance = Actor.Of("finance-1", "Rui Finance", Role.Finance);

    private CapReview.TestSupport.TestDatabase _database = null!;

    public ProposalService Proposals => _services.GetRequiredService<ProposalService>();

    public MarrPolicyService Marr => _services.GetRequiredService<MarrPolicyService>();

    public CycleService Cycles => _services.GetRequiredService<CycleService>();

    public DecisionService Decisions => _services.GetRequiredService<DecisionService>();

    public Comments.CommentService Comments => _services.GetRequiredService<Comments.CommentService>();

    public Portfolio.PortfolioRulesService PortfolioRules => _services.GetRequiredService<Portfolio.PortfolioRulesService>();

    public Portfolio.CycleRankingService Rankings => _services.GetRequiredService<Portfolio.CycleRankingService>();

    public Portfolio.PortfolioService Portfolio => _services.GetRequiredService<Portfolio.PortfolioService>();

    public CycleOverviewService Overviews => _services.GetRequiredService<CycleOverviewService>();

    public T Get<T>() where T : notnull => _services.GetRequiredService<T>();

    public Audit.AuditTrail Audit => _services.GetRequiredService<Audit.AuditTrail>();

    public Records.DecisionRecords Records => _services.GetRequiredService<Records.DecisionRecords>();

    public CapReviewDbContext NewContext() => _services.GetRequiredService<IDbContextFactory<CapReviewDbContext>>().CreateDbContext();

    public async Task InitializeAsync()
    {
        _database = CapReview.TestSupport.TestDatabase.Create(Path.Combine(_folder, "reviews.db"));
        _services = new ServiceCollection().AddReviews(_database.Settings)
            .AddSingleton<Interchange.IPeopleDirectory>(new KnownPeople([Admin, Lead, OtherLead, Reviewer, SecondReviewer, Finance])).BuildServiceProvider();
        await _services.GetRequiredService<DatabaseInitializer>().InitializeAsync(
            new OrganisationProfile { Name = "Test organisation", CurrencyCode = "EUR", CultureName = "en-IE" }, CancellationToken.None);
    }

    public async Task DisposeAsync()
    {
        await _services.DisposeAsync();
        await _database.DisposeAsync();
        try
        {
            Directory.Delete(_folder, recursive: true);
        }
        catch (IOException)
        {
            // Left for the system's temporary-file cleanup.
        }
    }

    /// <summary>An open cycle pinned to a fresh 8% policy version.</summary>
    public async Task<BudgetCycle> OpenCycleAsync(string name, decimal capitalLimit = 2_000_000m)
    {
        var marr = await Marr.AddVersionAsync(Admin, new NewMarrPolicy(0.08, Engine.Rates.RateBasis.Effective, 1, new DateOnly(2027, 1, 1), "Test policy"), CancellationToken.None);
        return await Cycles.CreateAsync(Admin, new NewBudgetCycle(name, capitalLimit, marr.Id, new DateOnly(2027, 1, 1), new DateOnly(2027, 3, 31)), CancellationToken.None);
    }

    public static ProposalDraft Draft(string title = "Chiller replacement", double firstCost = -120_000, string? reason = null, double saving = 24_000) => new(
        title,
        "Replace the 1998 chiller on the paint line.",
        ProposalCategory.Replacement,
        RiskClass.Standard,
        new ProposalAssumptions
        {
            Model = new ModelSpec
            {
                Horizon = 10,
                PeriodsPerYear = 1,
                Elements =
                [
                    new ElementSpec { Type = ElementKind.Single, Label = "Chiller", Category = CashFlowCategory.Capital, Period = 0, Amount = firstCost },
                    new ElementSpec { Type = ElementKind.Uniform, Label = "Electricity saved", Category = CashFlowCategory.Revenue, First = 1, Last = 10, Amount = saving },
                ],
            },
        },
        reason);
}
