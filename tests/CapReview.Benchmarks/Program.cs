using BenchmarkDotNet.Running;
using CapReview.Benchmarks;

// `dotnet run -c Release -- coverage` prints the root-coverage table, `-- packet-memory` the packets' peak memory;
// anything else goes to BenchmarkDotNet.
if (args.Length > 0 && args[0] == "coverage")
{
    RootCoverageReport.Print(casesPerKind: 1000);
    return;
}
if (args.Length > 0 && args[0] == "packet-memory")
{
    PacketMemoryReport.Print();
    return;
}
BenchmarkSwitcher.FromAssembly(typeof(EvaluationBenchmarks).Assembly).Run(args);
