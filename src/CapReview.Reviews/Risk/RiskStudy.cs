using CapReview.Engine.Risk;
using CapReview.Engine.Specifications;

namespace CapReview.Reviews.Risk;

/// <summary>
/// A proposal whose model is valid and whose risk settings were read without error, with at least one uncertain
/// parameter: what every analysis of <see cref="ProposalRisk"/> starts from.
/// </summary>
/// <param name="Proposal">The model (at the MARR it is judged by) and, after tax, its tax settings.</param>
/// <param name="Settings">The parameters, correlations, named scenarios, trials and seed as read.</param>
public sealed record RiskStudy(ProposalCase Proposal, RiskSettings Settings)
{
    /// <summary>True when the figures are the after-tax ones.</summary>
    public bool AfterTax => Proposal.Tax is not null;

    /// <summary>The parameters whose most likely value is not their input's value in the model: every face that shows the figures says so.</summary>
    public IReadOnlyList<ParameterDrift> Drifts { get; } = ParameterFollowing.Drifts(Proposal, Settings.Parameters);
}
