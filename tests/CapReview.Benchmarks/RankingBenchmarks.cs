using BenchmarkDotNet.Attributes;
using CapReview.Engine.Comparison;
using CapReview.Engine.Rates;
using CapReview.Engine.Specifications;
using CapReview.Reviews;
using CapReview.Reviews.Access;
using CapReview.Reviews.Cycles;
using CapReview.Reviews.Marr;
using CapReview.Reviews.Organisation;
using CapReview.Reviews.Portfolio;
using CapReview.Reviews.Proposals;
using CapReview.Reviews.Storage;
using Microsoft.Extensions.DependencyInjection;

namespace CapReview.Benchmarks;

/// <summary>
/// Target: ranking a cycle of 500 proposals with all measures under 50 ms. Measured twice: the engine alone from the
/// entered specifications, and the ranking service reading the proposals and their frozen versions from SQLite.
/// </summary>
[MemoryDiagnoser]
public class RankingBenchmarks
{
    private const int Proposals = 500;
    private static readonly Actor Lead = Actor.Of("lead", "Bench Lead", Role.ProjectLead);
    private static readonly Actor Board = Actor.Of("board", "Bench Board", Role.Reviewer);
    private static readonly Actor Admin = Actor.Of("admin", "Bench Admin", Role.Administrator);

    private ModelSpec[] _specs = [];
    private string _folder = "";
    private ServiceProvider _services = null!;
    private int _cycleId;

    [GlobalSetup]
    public void Setup()
    {
        var random = new Random(2027);
        _specs = [.. Enumerable.Range(0, Proposals).Select(_ => BenchmarkModels.VariedSpec(random))];
        _folder = Directory.CreateTempSubdirectory("capreview-bench-").FullName;
        _services = new ServiceCollection().AddReviews($"Data Source={Path.Combine(_folder, "bench.db")}").BuildServiceProvider();
        SeedAsync().GetAwaiter().GetResult();
    }

    private async Task SeedAsync()
    {
        var none = CancellationToken.None;
        await _services.GetRequiredService<DatabaseInitializer>().InitializeAsync(
            new OrganisationProfile { Name = "Benchmark", CurrencyCode = "EUR", CultureName = "en-IE" }, none);
        var marr = await _services.GetRequiredService<MarrPolicyService>().AddVersionAsync(Admin,
            new NewMarrPolicy(0.09, RateBasis.Effective, 1, new DateOnly(2027, 1, 1), "Benchmark policy"), none);
        var cycle = await _services.GetRequiredService<CycleService>().CreateAsync(Admin,
            new NewBudgetCycle("Benchmark cycle", 50_000_000m, marr.Id, new DateOnly(2027, 1, 1), new DateOnly(2027, 3, 31)), none);
        _cycleId = cycle.Id;
        var proposals = _services.GetRequiredService<ProposalService>();
        for (int k = 0; k < Proposals; k++)
        {
            var draft = await proposals.CreateDraftAsync(Lead, new ProposalDraft($"Line {k}", "", ProposalCategory.Expansion, RiskClass.Standard,
                new ProposalAssumptions { Model = _specs[k] with { Rate = null } }, null), none);
            await proposals.SubmitAsync(Lead, draft.Id, cycle.Id, draft.Revision, none);
        }
    }

    [GlobalCleanup]
    public void Cleanup()
    {
        _services.Dispose();
        Directory.Delete(_folder, recursive: true);
    }

    [Benchmark(Description = "Engine: read and rank 500 40-period proposals with all measures")]
    public double Engine()
    {
        var entries = _specs.Select((spec, k) =>
        {
            var read = SpecificationReader.Read(spec).Value!;
            return new RankingEntry($"P-{k:D4}", read.Model, read.Options.Marr);
        }).ToList();
        return ProposalRanking.Rank(entries)[0].AnnualWorth;
    }

    [Benchmark(Description = "Service: rank a stored cycle of 500 proposals (SQLite read, versions, all measures)")]
    public double Service() =>
        _services.GetRequiredService<CycleRankingService>().RankAsync(Board, _cycleId, 0.0, CancellationToken.None).GetAwaiter().GetResult().Rows[0].Ranked.AnnualWorth;
}
