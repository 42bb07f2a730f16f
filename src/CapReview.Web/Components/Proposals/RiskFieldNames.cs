using System.Globalization;
using System.Text.RegularExpressions;
using CapReview.Web.ProposalForms;

namespace CapReview.Web.Components.Proposals;

/// <summary>Where a risk message belongs, in the words of the panel ("Parameter 2, Life: "), never a field path.</summary>
internal static partial class RiskFieldNames
{
    public static string Of(string field, RiskDraft draft)
    {
        ArgumentNullException.ThrowIfNull(field);
        ArgumentNullException.ThrowIfNull(draft);
        Match m = Indexed().Match(field);
        if (!m.Success)
        {
            return field switch
            {
                "risk.trials" => "Trials: ",
                "risk.seed" => "Seed: ",
                "risk.correlations" => "Correlations: ",
                _ => "",
            };
        }
        int k = int.Parse(m.Groups[2].Value, CultureInfo.InvariantCulture);
        return m.Groups[1].Value switch
        {
            "parameters" => $"Parameter {k + 1}{(k < draft.Parameters.Count && draft.Parameters[k].Name.Trim().Length > 0 ? $" ({draft.Parameters[k].Name.Trim()})" : "")}: ",
            "correlations" => $"Correlation {k + 1}: ",
            _ => $"Scenario {k + 1}: ",
        };
    }

    [GeneratedRegex(@"^risk\.(parameters|correlations|scenarios)\[(\d+)\]")]
    private static partial Regex Indexed();
}
