using CapReview.Engine.CashFlows;
using CapReview.Engine.Rates;
using CapReview.Engine.Specifications;
using CapReview.Packets.Signing;
using CapReview.Reviews;
using CapReview.Reviews.Access;
using CapReview.Reviews.Cycles;
using CapReview.Reviews.Decisions;
using CapReview.Reviews.Marr;
using CapReview.Reviews.Organisation;
using CapReview.Reviews.Proposals;
using CapReview.Reviews.Storage;
using Microsoft.EntityFrameworkCore;
using Microsoft.Extensions.DependencyInjection;

namespace CapReview.Packets.Tests;

/// <summary>The domain and packet services on a real, migrated SQLite file, with a development certificate of its own.</summary>
public sealed class PacketDatabase : IAsyncLifetime
{
    private readonly string _folder = Directory.CreateTempSubdirectory("capreview-packetdb-").FullName;

    /// <summary>Where the database file lives: the fixture's own folder unless a test gives another (a small file system of its own).</summary>
    public string? DatabaseFolder { get; init; }

    public static readonly Actor Admin = Actor.Of("admin-1", "Ines Admin", Role.Administrator);
    public static readonly Actor Lead = Actor.Of("lead-1", "Oskar Lead", Role.ProjectLead);
    public static readonly Actor OtherLead = Actor.Of("lead-2", "Maren Lead", Role.ProjectLead);
    public static readonly Actor Board = Actor.Of("board-1", "Tove Board", Role.Reviewer);
    public static readonly Actor SecondBoard = Actor.Of("board-2", "Aino Board", Role.Reviewer);
    public static readonly Actor Finance = Actor.Of("finance-1", "Rui Finance", Role.Finance);

    /// <summary>The services' clock: the system's unless a test moves its own.</summary>
    public TimeProvider? Clock { get; init; }

    public ServiceProvider Services { get; private set; } = null!;

    /// <summary>Unlimited unless a test fills it.</summary>
    public FullDisk Disk { get; } = new();

    public T Get<T>() where T : notnull => Services.GetRequiredService<T>();

    public CapReviewDbContext NewContext() => Get<IDbContextFactory<CapReviewDbContext>>().CreateDbContext();

    public async Task InitializeAsync()
    {
        var services = new ServiceCollection()
            .AddReviews($"Data Source={Path.Combine(DatabaseFolder ?? _folder, "packets.db")};Pooling=False")
            .ConfigureDbContext<CapReviewDbContext>(options => options.AddInterceptors(Disk))
            .AddPackets(new PacketOptions { Signing = new PacketSigningOptions { DevelopmentCertificatePath = Path.Combine(_folder, "signing.pfx") } });
        if (Clock is not null)
        {
            services.AddSingleton(Clock);
        }
        Services = services.BuildServiceProvider();
        await Get<DatabaseInitializer>().InitializeAsync(new OrganisationProfile { Name = "Tarnby Components Ltd", CurrencyCode = "EUR", CultureName = "en-IE" }, CancellationToken.None);
    }

    public async Task DisposeAsync()
    {
        await Services.DisposeAsync();
        try
        {
            Directory.Delete(_folder, recursive: true);
        }
        catch (IOException)
        {
            // Left for the system's temporary-file cleanup.
        }
    }

    /// <summary>A cycle with the given proposals (first cost, yearly saving), each decided (the third rejected), signed off by two board members.</summary>
    public async Task<(BudgetCycle Cycle, IReadOnlyList<ProposalView> Proposals)> DecidedCycleAsync(string name, params (double Cost, double Saving)[] proposals)
    {
        var none = CancellationToken.None;
        var marr = await Get<MarrPolicyService>().AddVersionAsync(Admin, new NewMarrPolicy(0.08, RateBasis.Effective, 1, new DateOnly(2027, 1, 1), "Packet test policy"), none);
        var cycle = await Get<CycleService>().CreateAsync(Admin, new NewBudgetCycle(name, 1_000_000m, marr.Id, new DateOnly(2027, 1, 1), new DateOnly(2027, 3, 31)), none);
        var service = Get<ProposalService>();
        var views = new List<ProposalView>();
        for (int k = 0; k < proposals.Length; k++)
        {
            var (cost, saving) = proposals[k];
            var draft = await service.CreateDraftAsync(Lead, new ProposalDraft($"Line {k + 1} retrofit", "", ProposalCategory.CostReduction, RiskClass.Standard,
                new ProposalAssumptions
                {
                    Model = new ModelSpec
                    {
                        Horizon = 10,
                        Elements =
                        [
                            new ElementSpec { Type = ElementKind.Single, Label = "Retrofit", Category = CashFlowCategory.Capital, Period = 0, Amount = -cost },
                            new ElementSpec { Type = ElementKind.Uniform, Label = "Energy saved", Category = CashFlowCategory.Revenue, First = 1, Last = 10, Amount = saving },
                        ],
                    },
                }, null), none);
            var submitted = await service.SubmitAsync(Lead, draft.Id, cycle.Id, draft.Revision, none);
            await Get<DecisionService>().DecideAsync(Board, draft.Id, k == 2 ? DecisionOutcome.Reject : DecisionOutcome.Approve, k == 0 ? "Install in August" : "", submitted.Revision, none);
            views.Add(await service.GetAsync(Lead, draft.Id, none));
        }
        await Get<DecisionService>().SignOffAsync(Board, cycle.Id, none);
        await Get<DecisionService>().SignOffAsync(SecondBoard, cycle.Id, none);
        return (cycle, views);
    }
}
