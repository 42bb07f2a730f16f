using System.Globalization;
using System.Text;
using BenchmarkDotNet.Attributes;
using CapReview.Engine.Rates;
using CapReview.Reviews;
using CapReview.Reviews.Access;
using CapReview.Reviews.Cycles;
using CapReview.Reviews.Interchange;
using CapReview.Reviews.Marr;
using CapReview.Reviews.Organisation;
using CapReview.Reviews.Proposals;
using CapReview.Reviews.Storage;
using CapReview.Web.Exports;
using CapReview.Web.Importing;
using Microsoft.Extensions.DependencyInjection;

namespace CapReview.Benchmarks;

/// <summary>
/// Targets: the preview of the largest model file an import accepts (1,200 periods × 20 line items) under 200 ms, as
/// CSV and as XLSX; a cycle of 400 submitted proposals exported and imported as a cycle document under 2 s each.
/// </summary>
[MemoryDiagnoser]
public class InterchangeBenchmarks
{
    private const int Periods = 1_200, Items = 20, Proposals = 400;
    private static readonly Actor Lead = Actor.Of("lead", "Bench Lead", Role.ProjectLead);
    private static readonly Actor Admin = Actor.Of("admin", "Bench Admin", Role.Administrator);

    private byte[] _csv = [], _xlsx = [], _document = [];
    private string _folder = "";
    private ServiceProvider _services = null!;
    private int _cycleId, _imports;

    /// <summary>Nobody has an account in the benchmark's installation.</summary>
    private sealed class NoPeople : IPeopleDirectory
    {
        public Task<KnownPerson?> FindAsync(string userId, CancellationToken cancellationToken) => Task.FromResult<KnownPerson?>(null);

        public Task<KnownPerson?> FindByEmailAsync(string email, CancellationToken cancellationToken) => Task.FromResult<KnownPerson?>(null);
    }

    [GlobalSetup]
    public void Setup()
    {
        // A sheet that compresses little: each item changes every few periods.
        var random = new Random(2027);
        var header = string.Join(",", Enumerable.Range(0, Items).Select(k => $"Item {k} [{(k == 0 ? "capital" : "operating")}]"));
        var csv = new StringBuilder("period," + header + "\n");
        var rows = new List<IReadOnlyList<object?>>();
        var levels = Enumerable.Range(0, Items).Select(_ => (double)random.Next(-5_000, 5_000)).ToArray();
        for (int t = 0; t <= Periods; t++)
        {
            for (int k = 0; k < Items; k++)
            {
                if (random.Next(4) == 0)
                {
                    levels[k] = random.Next(-5_000, 5_000);
                }
            }
            csv.Append(t.ToString(CultureInfo.InvariantCulture)).Append(',').AppendJoin(',', levels.Select(v => v.ToString(CultureInfo.InvariantCulture))).Append('\n');
            rows.Add([t, .. levels.Select(v => (object?)v)]);
        }
        _csv = Encoding.UTF8.GetBytes(csv.ToString());
        _xlsx = XlsxExport.Write(new ExportTable("Cash flows", [],
            [new("period", ExportKind.Whole), .. Enumerable.Range(0, Items).Select(k => new ExportColumn($"Item {k} [{(k == 0 ? "capital" : "operating")}]", ExportKind.Money))], rows));

        _folder = Directory.CreateTempSubdirectory("capreview-bench-").FullName;
        _services = new ServiceCollection().AddReviews($"Data Source={Path.Combine(_folder, "bench.db")}")
            .AddSingleton<IPeopleDirectory, NoPeople>().BuildServiceProvider();
        SeedAsync().GetAwaiter().GetResult();
        _document = CycleDocumentJson.Write(_services.GetRequiredService<CycleExporter>().ExportAsync(Admin, _cycleId, CancellationToken.None).GetAwaiter().GetResult());
    }

    private async Task SeedAsync()
    {
        var none = CancellationToken.None;
        await _services.GetRequiredService<DatabaseInitializer>().InitializeAsync(new OrganisationProfile { Name = "Benchmark", CurrencyCode = "EUR", CultureName = "en-IE" }, none);
        var marr = await _services.GetRequiredService<MarrPolicyService>().AddVersionAsync(Admin, new NewMarrPolicy(0.09, RateBasis.Effective, 1, new DateOnly(2027, 1, 1), "Benchmark policy"), none);
        var cycle = await _services.GetRequiredService<CycleService>().CreateAsync(Admin, new NewBudgetCycle("Benchmark cycle", 50_000_000m, marr.Id, new DateOnly(2027, 1, 1), new DateOnly(2027, 3, 31)), none);
        _cycleId = cycle.Id;
        var proposals = _services.GetRequiredService<ProposalService>();
        var random = new Random(7);
        for (int k = 0; k < Proposals; k++)
        {
            var draft = await proposals.CreateDraftAsync(Lead, new ProposalDraft($"Line {k}", "", ProposalCategory.Expansion, RiskClass.Standard,
                new ProposalAssumptions { Model = BenchmarkModels.VariedSpec(random) with { Rate = null } }, null), none);
            await proposals.SubmitAsync(Lead, draft.Id, cycle.Id, draft.Revision, none);
        }
    }

    [GlobalCleanup]
    public void Cleanup()
    {
        _services.Dispose();
        Directory.Delete(_folder, recursive: true);
    }

    [Benchmark(Description = "Preview: CSV, 1,200 periods × 20 line items")]
    public int PreviewCsv() => ModelImport.Read("largest.csv", _csv, CultureInfo.InvariantCulture).Elements.Count;

    [Benchmark(Description = "Preview: XLSX, 1,200 periods × 20 line items")]
    public int PreviewXlsx() => ModelImport.Read("largest.xlsx", _xlsx, CultureInfo.InvariantCulture).Elements.Count;

    [Benchmark(Description = "Cycle document: export 400 proposals")]
    public int ExportCycle() => CycleDocumentJson.Write(_services.GetRequiredService<CycleExporter>().ExportAsync(Admin, _cycleId, CancellationToken.None).GetAwaiter().GetResult()).Length;

    [Benchmark(Description = "Cycle document: checked import of 400 proposals")]
    public int ImportCycle()
    {
        // Each import needs a cycle name of its own.
        string renamed = Encoding.UTF8.GetString(_document).Replace("\"Benchmark cycle\"", $"\"Benchmark cycle {++_imports}\"", StringComparison.Ordinal);
        return _services.GetRequiredService<CycleImporter>().ImportAsync(Admin, Encoding.UTF8.GetBytes(renamed), CancellationToken.None).GetAwaiter().GetResult().Proposals;
    }
}
