using CapReview.Reviews.Portfolio;

namespace CapReview.Web.Components.Portfolio;

/// <summary>The portfolio's what-if as typed: the capital limit as text, the MARR shift in points, the figures and the objective.</summary>
public sealed class PortfolioWhatIf
{
    /// <summary>The MARR shifts offered, in effective annual points.</summary>
    public static IReadOnlyList<double> Shifts { get; } = [-2, -1, 0, 1, 2];

    public string LimitText { get; set; } = "";

    public double Shift { get; set; }

    public bool AfterTax { get; set; }

    public SelectionObjective Objective { get; set; }

    /// <summary>Fills the fields from the portfolio calculated, so that they say what is shown.</summary>
    public void Show(PortfolioResult result, string limitText)
    {
        ArgumentNullException.ThrowIfNull(result);
        LimitText = limitText;
        Shift = result.Ranking.MarrShift * 100;
        Objective = result.Objective;
        AfterTax = result.Ranking.AfterTax;
    }
}
