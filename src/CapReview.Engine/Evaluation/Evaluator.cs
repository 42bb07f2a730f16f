using CapReview.Engine.Specifications;
using CapReview.Engine.Validation;

namespace CapReview.Engine.Evaluation;

/// <summary>The engine's front door: an entered model in, every measure or every input error out, never an exception for bad input.</summary>
public static class Evaluator
{
    public static Outcome<Evaluation> Evaluate(ModelSpec spec)
    {
        Outcome<ReadSpecification> read = SpecificationReader.Read(spec);
        if (!read.IsValid)
        {
            return Outcome.Failure<Evaluation>(read.Errors);
        }
        return ModelEvaluator.TryEvaluate(read.Value!.Model, read.Value.Options);
    }
}
