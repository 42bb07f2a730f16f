using BenchmarkDotNet.Attributes;
using CapReview.Engine.CashFlows;
using CapReview.Engine.Evaluation;
using CapReview.Engine.Specifications;

namespace CapReview.Benchmarks;

/// <summary>Target: every measure of the 40-period, 10-element model, every rate-of-return root included, under 20 µs.</summary>
[MemoryDiagnoser]
public class EvaluationBenchmarks
{
    private ModelSpec _spec = null!;
    private CashFlowModel _model = null!;
    private EvaluationOptions _options = null!;

    [GlobalSetup]
    public void Setup()
    {
        _spec = BenchmarkModels.Spec();
        var read = SpecificationReader.Read(_spec).Value!;
        _model = read.Model;
        _options = read.Options;
    }

    [Benchmark(Description = "Evaluate from the entered specification (validate, expand, all measures)")]
    public Evaluation FromSpecification() => Evaluator.Evaluate(_spec).Value!;

    [Benchmark(Description = "Evaluate a validated model (all measures)")]
    public Evaluation ValidatedModel() => ModelEvaluator.Evaluate(_model, _options);
}
