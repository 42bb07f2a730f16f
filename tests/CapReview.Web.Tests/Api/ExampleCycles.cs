using CapReview.Engine.Comparison;
using CapReview.Reviews.Access;
using CapReview.Reviews.Portfolio;
using CapReview.Reviews.Proposals;
using Microsoft.Extensions.DependencyInjection;

namespace CapReview.Web.Tests.Api;

/// <summary>
/// The cycles docs/api.md's examples read, written first into the examples' empty database so that their numbers are
/// the ones the document shows: cycle 1 (10 %, 500,000) with proposals 1 to 3, and cycle 2 (10 %) with the two ways of
/// replacing a boiler (4 and 5, an exclusive group) and a press replacement with its service-life estimates (6).
/// </summary>
public static class ExampleCycles
{
    private static readonly SemaphoreSlim Once = new(1, 1);

    public static async Task EnsureAsync(ApiFactory factory)
    {
        ArgumentNullException.ThrowIfNull(factory);
        await Once.WaitAsync();
        try
        {
            var cycles = factory.Services.GetRequiredService<CapReview.Reviews.Cycles.CycleService>();
            if ((await cycles.ListAsync(CancellationToken.None)).Any(c => c.Name == "Example plan 2027"))
            {
                return;
            }
            var (first, _) = await factory.CycleWithSubmittedProposalAsync("Example plan 2027", 0.10, ApiFactory.Draft("Hall crane", 10, 300_000, 58_600), "example-lead");
            await SubmitAsync(factory, first.Id, ApiFactory.Draft("Kiln burners", 10, 250_000, 49_700));
            await SubmitAsync(factory, first.Id, ApiFactory.Draft("Dust extraction", 10, 250_000, 48_800));

            var (second, small) = await factory.CycleWithSubmittedProposalAsync("Example boilers 2027", 0.10, ApiFactory.Draft("Boiler, small", 10, 200_000, 40_000), "example-lead");
            var large = await SubmitAsync(factory, second.Id, ApiFactory.Draft("Boiler, large", 10, 260_000, 50_000));
            var press = ApiFactory.Draft("Press 4 replacement", 10, 180_000, 30_000, category: ProposalCategory.Replacement);
            await SubmitAsync(factory, second.Id, press with
            {
                Assumptions = press.Assumptions with
                {
                    Replacement = new ReplacementEstimates(60_000,
                        [new ServiceYear(50_000, 15_000), new ServiceYear(42_000, 18_000)],
                        [new ServiceYear(140_000, 5_000), new ServiceYear(110_000, 7_000), new ServiceYear(85_000, 10_000)]),
                },
            });
            await factory.Services.GetRequiredService<PortfolioRulesService>().SaveGroupAsync(Actor.Of("example-board", "Example board", Role.Reviewer),
                second.Id, new GroupDraft("Boiler", true, [small.Id, large.Id]), CancellationToken.None);
        }
        finally
        {
            Once.Release();
        }
    }

    private static async Task<ProposalView> SubmitAsync(ApiFactory factory, int cycleId, ProposalDraft draft)
    {
        var lead = Actor.Of("example-lead", "Example lead", Role.ProjectLead);
        var proposals = factory.Services.GetRequiredService<ProposalService>();
        var created = await proposals.CreateDraftAsync(lead, draft, CancellationToken.None);
        return await proposals.SubmitAsync(lead, created.Id, cycleId, created.Revision, CancellationToken.None);
    }
}
