using CapReview.Reviews.Portfolio;
using CapReview.Web.Identity;

namespace CapReview.Web.Api;

/// <summary>GET /api/v1/cycles/{id}/portfolio: a cycle's funded portfolio for the what-if the portfolio page offers.</summary>
public static class PortfolioEndpoints
{
    public static IEndpointRouteBuilder MapPortfolioEndpoints(this IEndpointRouteBuilder routes)
    {
        routes.MapGet("/api/v1/cycles/{id:int}/portfolio", PortfolioAsync)
            .WithName("GetCyclePortfolio")
            .WithSummary("A cycle's optimal portfolio beside the greedy fill by ranking, their difference and the efficient frontier")
            .WithDescription("Query: objective=presentWorth or annualWorth (default: the cycle's); limit=capital now (default: the cycle's); shift=MARR points, −10 to 10; basis=beforeTax (default) or afterTax. Board, finance and administrators only. Results are estimates.")
            .Produces<PortfolioResponse>()
            .ProducesValidationProblem()
            .ProducesProblem(StatusCodes.Status403Forbidden)
            .ProducesProblem(StatusCodes.Status404NotFound)
            .ProducesProblem(StatusCodes.Status429TooManyRequests)
            .RequireAuthorization(IdentityRegistration.Api);
        return routes;
    }

    private static async Task<IResult> PortfolioAsync(int id, HttpContext context, PortfolioService portfolio, CancellationToken cancellationToken)
    {
        if (!WhatIfQuery.TryRead(context.Request.Query, out PortfolioQuery query, out IResult? problem))
        {
            return problem!;
        }
        return await ApiProblems.RunAsync(async () => Results.Ok(PortfolioResponse.From(
            await portfolio.SelectAsync(ActorFactory.From(context.User)!, id, query, cancellationToken).ConfigureAwait(false)))).ConfigureAwait(false);
    }
}
