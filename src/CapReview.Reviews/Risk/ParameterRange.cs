using System.Globalization;
using CapReview.Engine.Risk;
using CapReview.Engine.Validation;

namespace CapReview.Reviews.Risk;

/// <summary>
/// Every value a parameter names must leave a model that can be evaluated: a life shorter than an element's last
/// period, a last period past the life, a MARR or a growth beyond what any figure can hold. Such a value is refused at
/// its own field, in words, instead of turning into a gap in the tornado, a scenario without a figure or a simulation
/// whose trials silently drop out.
/// </summary>
public static class ParameterRange
{
    /// <summary>The errors of the parameters' low, most likely and high values (each set alone in the model as entered); empty when all can be evaluated.</summary>
    public static IReadOnlyList<InputError> Check(ProposalCase proposal, IReadOnlyList<UncertainParameter> parameters)
    {
        ArgumentNullException.ThrowIfNull(proposal);
        ArgumentNullException.ThrowIfNull(parameters);
        var errors = new List<InputError>();
        for (int k = 0; k < parameters.Count; k++)
        {
            UncertainParameter p = parameters[k];
            foreach (var (field, name, value) in new[] { ("low", "Low", p.Low), ("mostLikely", "Most likely", p.MostLikely), ("high", "High", p.High) })
            {
                var outcome = proposal.With(p.Target, value).Evaluate();
                if (!outcome.IsValid)
                {
                    string shown = Shown(p.Target, value);
                    errors.Add(new($"risk.parameters[{k}].{field}", $"{name}: at {shown} the model cannot be evaluated ({outcome.Errors[0].Message.TrimEnd('.')}). Choose a value the model allows."));
                    // One message per parameter: its other ends most often fail for the same reason.
                    break;
                }
            }
        }
        return errors;
    }

    private static string Shown(string target, double value) =>
        RiskUnits.IsRate(target) ? RiskUnits.Entered(target, value).ToString("0.####", CultureInfo.InvariantCulture) + " %" : value.ToString("#,##0.####", CultureInfo.InvariantCulture);
}
