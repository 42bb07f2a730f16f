using CapReview.Reviews.Portfolio;
using CapReview.Reviews.Proposals;
using CapReview.Web.Identity;

namespace CapReview.Web.Api;

/// <summary>
/// The analyses that apply to one version of a proposal: the incremental analysis of its exclusive group, and keep or
/// replace for a replacement with estimates of the asset in service. Where an analysis does not apply, problem details
/// say why (404 when the proposal has no such analysis, 400 when the version asked is not the one it rests on).
/// </summary>
public static class VersionAnalysisEndpoints
{
    public static IEndpointRouteBuilder MapVersionAnalysisEndpoints(this IEndpointRouteBuilder routes)
    {
        routes.MapGet("/api/v1/proposals/{id:int}/versions/{number:int}/incremental", IncrementalAsync)
            .WithName("GetVersionIncrementalAnalysis")
            .WithSummary("The incremental analysis of the exclusive group the version belongs to, as the cycle ranks it")
            .WithDescription("Board, finance and administrators only. 404 when the proposal is in no cycle or no exclusive group; 400 when the cycle ranks another version of it.")
            .Produces<IncrementalAnalysisResponse>()
            .ProducesValidationProblem()
            .ProducesProblem(StatusCodes.Status403Forbidden)
            .ProducesProblem(StatusCodes.Status404NotFound)
            .RequireAuthorization(IdentityRegistration.Api);
        routes.MapGet("/api/v1/proposals/{id:int}/versions/{number:int}/replacement", ReplacementAsync)
            .WithName("GetVersionReplacementAnalysis")
            .WithSummary("Keep or replace: the economic service lives of the asset in service and of the proposed one, and the advice")
            .WithDescription("For whoever may read the proposal. 400 when the version has no estimates of the asset it replaces or its model is not complete.")
            .Produces<ReplacementResponse>()
            .ProducesValidationProblem()
            .ProducesProblem(StatusCodes.Status404NotFound)
            .RequireAuthorization(IdentityRegistration.Api);
        return routes;
    }

    private static Task<IResult> IncrementalAsync(int id, int number, HttpContext context, IncrementalAnalysisService analyses, CancellationToken cancellationToken) =>
        ApiProblems.RunAsync(async () => Results.Ok(IncrementalAnalysisResponse.From(
            await analyses.ForVersionAsync(ActorFactory.From(context.User)!, id, number, cancellationToken).ConfigureAwait(false))));

    private static Task<IResult> ReplacementAsync(int id, int number, HttpContext context, ReplacementService replacements, CancellationToken cancellationToken) =>
        ApiProblems.RunAsync(async () => Results.Ok(ReplacementResponse.From(
            await replacements.AdviseAsync(ActorFactory.From(context.User)!, id, number, cancellationToken).ConfigureAwait(false))));
}
