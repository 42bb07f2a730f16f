using CapReview.Reviews.Common;
using CapReview.Reviews.Cycles;
using CapReview.Reviews.Portfolio;
using CapReview.Web.Identity;

namespace CapReview.Web.Api;

/// <summary>GET /api/v1/cycles and GET /api/v1/cycles/{id}/ranking: the cycles, and a cycle's ranking for the board, finance and administrators.</summary>
public static class CycleEndpoints
{
    public static IEndpointRouteBuilder MapCycleEndpoints(this IEndpointRouteBuilder routes)
    {
        routes.MapGet("/api/v1/cycles", ListAsync)
            .WithName("ListCycles")
            .WithSummary("The budget cycles, newest first")
            .Produces<IReadOnlyList<CycleResponse>>()
            .RequireAuthorization(IdentityRegistration.Api);
        routes.MapGet("/api/v1/cycles/{id:int}/ranking", RankingAsync)
            .WithName("GetCycleRanking")
            .WithSummary("A cycle's proposals ranked by annual worth on the cycle's basis")
            .WithDescription("Query: basis=beforeTax (default) or afterTax; shift=MARR points, −10 to 10. Board, finance and administrators only. Results are estimates.")
            .Produces<RankingResponse>()
            .ProducesProblem(StatusCodes.Status403Forbidden)
            .ProducesProblem(StatusCodes.Status404NotFound)
            .RequireAuthorization(IdentityRegistration.Api);
        return routes;
    }

    private static async Task<IResult> ListAsync(CycleService cycles, CancellationToken cancellationToken) =>
        Results.Ok((await cycles.ListAsync(cancellationToken).ConfigureAwait(false)).Select(CycleResponse.From).ToList());

    private static async Task<IResult> RankingAsync(int id, HttpContext context, CycleRankingService rankings, CancellationToken cancellationToken)
    {
        if (!WhatIfQuery.TryRead(context.Request.Query, out PortfolioQuery query, out IResult? problem))
        {
            return problem!;
        }
        return await ApiProblems.RunAsync(async () => Results.Ok(RankingResponse.From(
            await rankings.RankAsync(ActorFactory.From(context.User)!, id, query.MarrShift, cancellationToken, query.AfterTax).ConfigureAwait(false)))).ConfigureAwait(false);
    }
}
