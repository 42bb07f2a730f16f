using CapReview.Engine.Risk;

namespace CapReview.Reviews.Risk;

/// <summary>
/// A parameter whose most likely value is not the value its input has in the model: the tornado, the scenarios and
/// the simulation then centre on another proposal than the one entered, and every face must say so.
/// </summary>
/// <param name="Index">The parameter's place in the risk settings, from 0.</param>
/// <param name="Parameter">The parameter as read.</param>
/// <param name="Current">The input's value in the model now (stored units: rates as fractions).</param>
public sealed record ParameterDrift(int Index, UncertainParameter Parameter, double Current)
{
    /// <summary>Most likely less the model's value.</summary>
    public double Difference => Parameter.MostLikely - Current;
}
