using BenchmarkDotNet.Running;
using CapReview.Benchmarks;

// `dotnet run -c Release -- coverage` prints the root-coverage table; anything else goes to BenchmarkDotNet.
if (args.Length > 0 && args[0] == "coverage")
{
    RootCoverageReport.Print(casesPerKind: 1000);
    return;
}
BenchmarkSwitcher.FromAssembly(typeof(EvaluationBenchmarks).Assembly).Run(args);
