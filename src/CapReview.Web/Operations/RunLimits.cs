using CapReview.Reviews.Runs;

namespace CapReview.Web.Operations;

/// <summary>Reads the section <c>Runs</c> (docs/operations.md) into the domain's run limits, refusing a setting that would stop every run.</summary>
public static class RunLimits
{
    public static RunLimitOptions Read(IConfiguration configuration)
    {
        ArgumentNullException.ThrowIfNull(configuration);
        var options = configuration.GetSection("Runs").Get<RunLimitOptions>() ?? new RunLimitOptions();
        if (options.PerPerson < 1 || options.PerServer < 1 || options.WorkBudget < 1)
        {
            throw new InvalidOperationException("Runs:PerPerson, Runs:PerServer and Runs:WorkBudget must each be at least 1.");
        }
        return options;
    }
}
