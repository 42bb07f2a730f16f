using System.Globalization;
using BenchmarkDotNet.Attributes;
using CapReview.Packets;
using CapReview.Packets.Content;
using CapReview.Packets.Signing;
using CapReview.Reviews.Cycles;
using CapReview.Reviews.Decisions;
using CapReview.Reviews.Marr;
using CapReview.Reviews.Proposals;

namespace CapReview.Benchmarks;

/// <summary>
/// Targets: a single-proposal packet under 300 ms; a 30-proposal cycle packet under 5 s with peak memory under
/// 300 MB (the peak is measured by <c>-- packet-memory</c>, in a process of its own). Each packet is laid out, its
/// charts drawn, signed (RSA 3072, SHA-256) and written out; the benchmark model is the 40-period, 10-element one.
/// </summary>
[MemoryDiagnoser]
public class PacketBenchmarks
{
    private PacketCertificate _certificate = null!;
    private string _folder = "";

    [GlobalSetup]
    public void Setup()
    {
        _folder = Directory.CreateTempSubdirectory("capreview-bench-packets-").FullName;
        _certificate = PacketCertificate.Load(new PacketSigningOptions { DevelopmentCertificatePath = Path.Combine(_folder, "signing.pfx") }, BenchmarkPackets.Organisation.Name);
    }

    [GlobalCleanup]
    public void Cleanup()
    {
        _certificate.Dispose();
        Directory.Delete(_folder, recursive: true);
    }

    // The figures are gathered from the domain inside each run, as the packet service does before it renders.
    [Benchmark(Description = "Single-proposal packet: gather the figures, lay out, draw, sign, write")]
    public int Proposal() => PacketRenderer.Proposal(BenchmarkPackets.Proposal(1, new Random(2027)), _certificate).Length;

    [Benchmark(Description = "Cycle packet of 30 proposals: gather the figures, lay out, draw, sign, write")]
    public int Cycle() => PacketRenderer.Cycle(BenchmarkPackets.Cycle(30), _certificate).Length;
}

/// <summary>Invented packet contents for the benchmarks: proposals on the benchmark model, decided and signed off.</summary>
internal static class BenchmarkPackets
{
    public static readonly PacketOrganisation Organisation = new("Benchmark Works Ltd", "EUR", CultureInfo.GetCultureInfo("en-IE"));
    private static readonly DateTimeOffset Made = new(2027, 3, 30, 9, 0, 0, TimeSpan.Zero);

    private static readonly BudgetCycle BenchCycle = BudgetCycle.Imported(
        new NewBudgetCycle("Benchmark plan", 90_000_000m, 1, new DateOnly(2027, 1, 1), new DateOnly(2027, 3, 1), 2), CycleStatus.Decided, null, [], Reviews.Portfolio.SelectionObjective.PresentWorth);

    private static readonly MarrPolicyVersion Policy = new(1, new NewMarrPolicy(0.09, Engine.Rates.RateBasis.Effective, 1, new DateOnly(2027, 1, 1), "Benchmark"), "bench", default);

    private static readonly SignOff[] Signed =
    [
        new(1, "b1", "First Member", Made, "[]"),
        new(1, "b2", "Second Member", Made, "[]"),
    ];

    public static ProposalPacketData Proposal(int id, Random random)
    {
        var (proposal, decision) = Decided(id, random);
        return new ProposalPacketData(Organisation, BenchCycle, Policy, proposal, decision, Figures(proposal, decision), Signed, Made, new SigningNotice("", "", true));
    }

    public static CyclePacketData Cycle(int proposals)
    {
        var random = new Random(2027);
        var decided = Enumerable.Range(1, proposals).Select(k => Decided(k, random)).ToList();
        return new CyclePacketData(Organisation, BenchCycle, Policy, Signed, decided, decided.ToDictionary(d => d.Item1.Id, d => Figures(d.Item1, d.Item2)), null, Made,
            new SigningNotice("", "", true));
    }

    private static VersionFigures Figures(ProposalView proposal, Decision decision) =>
        VersionFigures.Of(proposal, proposal.Version(decision.VersionNumber), Policy, BenchCycle.StudyPeriodYears, simulate: true);

    private static (ProposalView, Decision) Decided(int id, Random random)
    {
        VersionView Version(int number, Engine.Specifications.ModelSpec model)
        {
            var assumptions = new ProposalAssumptions { Model = model with { Rate = null } };
            return new VersionView(number, "lead", Made.AddDays(number - 30), number == 1 ? "First draft" : "Revised", true, Made.AddDays(number - 29),
                AssumptionsDocument.Hash(AssumptionsDocument.Serialize(assumptions)), assumptions);
        }
        var versions = new[] { Version(1, BenchmarkModels.VariedSpec(random)), Version(2, BenchmarkModels.VariedSpec(random)) };
        var proposal = new ProposalView(id, $"P-{id:D4}", "lead", $"Plant line {id}", "", ProposalCategory.Expansion, RiskClass.Standard, ProposalStatus.Approved, 1, 3, versions);
        var decision = new Decision(id, 1, 2, versions[1].AssumptionsHash, 1, DecisionOutcome.Approve, "", "b1", Made);
        return (proposal, decision);
    }
}

/// <summary>`-- packet-memory`: the peak working set of a process that makes the 30-proposal cycle packet.</summary>
internal static class PacketMemoryReport
{
    public static void Print()
    {
        string folder = Directory.CreateTempSubdirectory("capreview-packet-memory-").FullName;
        using var certificate = PacketCertificate.Load(new PacketSigningOptions { DevelopmentCertificatePath = Path.Combine(folder, "signing.pfx") }, "Benchmark Works Ltd");
        var data = BenchmarkPackets.Cycle(30);
        using var process = System.Diagnostics.Process.GetCurrentProcess();
        long before = process.PeakWorkingSet64;
        var watch = System.Diagnostics.Stopwatch.StartNew();
        int bytes = PacketRenderer.Cycle(data, certificate).Length;
        watch.Stop();
        process.Refresh();
        Console.WriteLine(string.Create(CultureInfo.InvariantCulture,
            $"30-proposal cycle packet: {bytes / 1024.0:0} KB in {watch.Elapsed.TotalMilliseconds:0} ms; peak working set {process.PeakWorkingSet64 / 1048576.0:0} MB (before: {before / 1048576.0:0} MB)"));
        Directory.Delete(folder, recursive: true);
    }
}
