namespace CapReview.Reviews.Runs;

/// <summary>
/// How much simulation and solving one server takes on at once (configuration section <c>Runs</c>; docs/operations.md):
/// runs at a time for one person and for the whole server, and the work one run may ask for.
/// </summary>
public sealed class RunLimitOptions
{
    /// <summary>Simulations and solver runs one person may have going at once, across their pages and tokens.</summary>
    public int PerPerson { get; set; } = 2;

    /// <summary>Simulations and solver runs the server runs at once, for everyone together.</summary>
    public int PerServer { get; set; } = 4;

    /// <summary>
    /// The most work one run may ask for, counted as trials × periods × elements (each trial writes every element's
    /// flows into every period): 2 × 10^9, a million trials of a 40-year monthly model of four elements.
    /// </summary>
    public long WorkBudget { get; set; } = 2_000_000_000;
}
