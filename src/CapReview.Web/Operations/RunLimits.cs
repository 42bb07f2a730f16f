using CapReview.Reviews.Runs;

namespace CapReview.Web.Operations;

/// <summary>Reads the section <c>Runs</c> (docs/operations.md) into the domain's run limits, refusing a setting that would stop every run.</summary>
public static class RunLimits
{
    public static RunLimitOptions Read(IConfiguration configuration)
    {
        ArgumentNullException.ThrowIfNull(configuration);
        var options = configuration.GetSection("Runs").Get<RunLimitOptions>() ?? new RunLimitOptions();
        foreach (var (name, value) in new (string, long)[] { ("Runs:PerPerson", options.PerPerson), ("Runs:PerServer", options.PerServer), ("Runs:WorkBudget", options.WorkBudget) })
        {
            if (value < 1)
            {
                throw new InvalidOperationException($"{name} must be at least 1: with {value} no simulation or portfolio calculation could run.");
            }
        }
        return options;
    }
}
