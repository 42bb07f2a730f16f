using CapReview.Reviews.Runs;
using CapReview.Web.Operations;
using Microsoft.Extensions.Configuration;

namespace CapReview.Web.Tests.Operations;

/// <summary>The section Runs as docs/operations.md states it: its defaults, and a setting that would stop every run refused at start.</summary>
public sealed class RunLimitSettingsTests
{
    [Fact]
    public void The_shipped_settings_and_the_defaults_are_the_documented_ones()
    {
        var shipped = RunLimits.Read(new ConfigurationBuilder().AddJsonFile(RepositoryFolder.Path("src", "CapReview.Web", "appsettings.json")).Build());
        var unset = RunLimits.Read(new ConfigurationBuilder().Build());
        foreach (RunLimitOptions options in new[] { shipped, unset })
        {
            Assert.Equal(2, options.PerPerson);
            Assert.Equal(4, options.PerServer);
            Assert.Equal(2_000_000_000, options.WorkBudget);
        }
    }

    [Theory]
    [InlineData("Runs:PerPerson")]
    [InlineData("Runs:PerServer")]
    [InlineData("Runs:WorkBudget")]
    public void A_setting_below_1_stops_the_start_with_its_name(string setting)
    {
        var configuration = new ConfigurationBuilder().AddInMemoryCollection([new(setting, "0")]).Build();
        var refused = Assert.Throws<InvalidOperationException>(() => RunLimits.Read(configuration));
        Assert.StartsWith(setting + " must be at least 1", refused.Message, StringComparison.Ordinal);
    }
}
