using CapReview.Engine.Risk;
using CapReview.Engine.Specifications;

namespace CapReview.Reviews.Risk;

/// <summary>
/// Keeps a proposal's uncertain parameters with the model they vary. A parameter whose most likely value is its
/// input's value follows that input: when the model changes, its low, most likely and high move by the same amount.
/// A parameter set apart from the model (the lead's most likely differs on purpose) is left as it is and reported as
/// a <see cref="ParameterDrift"/>, so no figure centres on another proposal than the one entered without saying so.
/// </summary>
public static class ParameterFollowing
{
    /// <summary>The parameters whose most likely value is not their input's value in <paramref name="proposal"/>.</summary>
    public static IReadOnlyList<ParameterDrift> Drifts(ProposalCase proposal, IReadOnlyList<UncertainParameter> parameters)
    {
        ArgumentNullException.ThrowIfNull(proposal);
        ArgumentNullException.ThrowIfNull(parameters);
        var drifts = new List<ParameterDrift>();
        for (int k = 0; k < parameters.Count; k++)
        {
            if (proposal.ValueAt(parameters[k].Target) is double current && !Same(current, parameters[k].MostLikely))
            {
                drifts.Add(new ParameterDrift(k, parameters[k], current));
            }
        }
        return drifts;
    }

    /// <summary>
    /// The risk settings after the model changed from <paramref name="before"/> to <paramref name="after"/>: each
    /// parameter that followed its input (most likely equal to the input's earlier value) moved with it, low and
    /// high keeping their distance from most likely; every other parameter unchanged.
    /// </summary>
    public static RiskSpec Follow(RiskSpec risk, ProposalCase before, ProposalCase after)
    {
        ArgumentNullException.ThrowIfNull(risk);
        ArgumentNullException.ThrowIfNull(before);
        ArgumentNullException.ThrowIfNull(after);
        return risk with { Parameters = [.. (risk.Parameters ?? []).Select(p => Follow(p, before, after))] };
    }

    private static ParameterSpec? Follow(ParameterSpec? p, ProposalCase before, ProposalCase after)
    {
        if (p?.Target is not { } target || p.MostLikely is not double likely
            || before.ValueAt(target) is not double was || after.ValueAt(target) is not double now
            || !Same(was, likely) || Same(was, now))
        {
            return p;
        }
        double shift = now - likely;
        return p with { Low = p.Low + shift, MostLikely = now, High = p.High + shift };
    }

    // Values typed and read back through text differ from the model's in the last digits only.
    private static bool Same(double a, double b) => Math.Abs(a - b) <= 1e-9 * Math.Max(1, Math.Max(Math.Abs(a), Math.Abs(b)));
}
