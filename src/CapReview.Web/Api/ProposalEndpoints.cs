using CapReview.Reviews.Access;
using CapReview.Reviews.Common;
using CapReview.Reviews.Cycles;
using CapReview.Reviews.Marr;
using CapReview.Reviews.Proposals;
using CapReview.Web.Identity;

namespace CapReview.Web.Api;

/// <summary>
/// The proposals a caller may see and their versions, and a lead's new draft. Another lead's proposal is answered
/// like a missing one (404), as on the pages.
/// </summary>
public static class ProposalEndpoints
{
    public static IEndpointRouteBuilder MapProposalEndpoints(this IEndpointRouteBuilder routes)
    {
        routes.MapGet("/api/v1/proposals", ListAsync)
            .WithName("ListProposals")
            .WithSummary("The caller's own proposals, newest first; with cycle={id}, the proposals of that cycle the caller may see")
            .Produces<IReadOnlyList<ProposalResponse>>()
            .RequireAuthorization(IdentityRegistration.Api);
        routes.MapPost("/api/v1/proposals", CreateAsync)
            .WithName("CreateProposal")
            .WithSummary("Start a draft proposal (project leads)")
            .WithDescription("The assumptions take the stored form shown by GET …/versions/{number}. Bad input returns problem details naming the field.")
            .Accepts<NewProposalRequest>("application/json")
            .Produces<ProposalResponse>(StatusCodes.Status201Created)
            .ProducesValidationProblem()
            .ProducesProblem(StatusCodes.Status403Forbidden)
            .RequireAuthorization(IdentityRegistration.Api)
            .DisableAntiforgery();
        routes.MapGet("/api/v1/proposals/{id:int}", GetAsync)
            .WithName("GetProposal")
            .WithSummary("A proposal and the summary of each version")
            .Produces<ProposalResponse>()
            .ProducesProblem(StatusCodes.Status404NotFound)
            .RequireAuthorization(IdentityRegistration.Api);
        routes.MapGet("/api/v1/proposals/{id:int}/versions/{number:int}", VersionAsync)
            .WithName("GetProposalVersion")
            .WithSummary("One version: its assumptions, their SHA-256 and its measures at the board's MARR")
            .WithDescription("The MARR policy is the one of the cycle the proposal is in, or the current one for a draft outside any cycle. Results are estimates.")
            .Produces<VersionResponse>()
            .ProducesProblem(StatusCodes.Status404NotFound)
            .RequireAuthorization(IdentityRegistration.Api);
        return routes;
    }

    private static Actor Caller(HttpContext context) => ActorFactory.From(context.User)!;

    private static async Task<IResult> ListAsync(HttpContext context, ProposalService proposals, CancellationToken cancellationToken)
    {
        string? cycle = context.Request.Query["cycle"];
        if (cycle is null)
        {
            return Results.Ok((await proposals.ListOwnAsync(Caller(context), cancellationToken).ConfigureAwait(false)).Select(ProposalResponse.From).ToList());
        }
        if (!int.TryParse(cycle, System.Globalization.NumberStyles.None, System.Globalization.CultureInfo.InvariantCulture, out int cycleId))
        {
            return ApiProblems.Invalid("cycle", "Give the cycle's id, a whole number.");
        }
        return Results.Ok((await proposals.ListInCycleAsync(Caller(context), cycleId, cancellationToken).ConfigureAwait(false)).Select(ProposalResponse.From).ToList());
    }

    private static Task<IResult> GetAsync(int id, HttpContext context, ProposalService proposals, CancellationToken cancellationToken) =>
        ApiProblems.RunAsync(async () => Results.Ok(ProposalResponse.From(await proposals.GetAsync(Caller(context), id, cancellationToken).ConfigureAwait(false))));

    private static Task<IResult> VersionAsync(int id, int number, HttpContext context, ProposalService proposals, CycleService cycles, MarrPolicyService policies, CancellationToken cancellationToken) =>
        ApiProblems.RunAsync(async () =>
        {
            ProposalView proposal = await proposals.GetAsync(Caller(context), id, cancellationToken).ConfigureAwait(false);
            VersionView version = proposal.Version(number);
            MarrPolicyVersion policy = await BoardPolicy.ForAsync(proposal, cycles, policies, cancellationToken).ConfigureAwait(false);
            var evaluation = VersionComparison.Evaluate(version.Assumptions, policy, proposal.RiskClass);
            return Results.Ok(new VersionResponse(proposal.Id, proposal.Reference, version.Number, version.CreatedAt, version.Reason, version.IsFrozen, version.FrozenAt,
                version.AssumptionsHash, version.Assumptions, policy.Number, evaluation is null ? null : EvaluationResponse.From(evaluation),
                evaluation is null ? "The model of this version is not complete." : null, version.Intact));
        });

    private static async Task<IResult> CreateAsync(HttpRequest request, ProposalService proposals, CancellationToken cancellationToken)
    {
        var (body, problem) = await ApiBody.ReadAsync<NewProposalRequest>(request, "the proposal", cancellationToken).ConfigureAwait(false);
        if (body is null)
        {
            return problem!;
        }
        if (string.IsNullOrWhiteSpace(body.Title))
        {
            return ApiProblems.Invalid("title", "Give the proposal a title.");
        }
        if (body.Assumptions?.Model is null)
        {
            return ApiProblems.Invalid("assumptions.model", "Give the model: at least its horizon and elements (a draft may be incomplete).");
        }
        var draft = new ProposalDraft(body.Title, body.Description ?? "", body.Category ?? ProposalCategory.Other, body.RiskClass ?? RiskClass.Standard, body.Assumptions);
        return await ApiProblems.RunAsync(async () =>
        {
            ProposalView created = await proposals.CreateDraftAsync(ActorFactory.From(request.HttpContext.User)!, draft, cancellationToken).ConfigureAwait(false);
            return Results.Created($"/api/v1/proposals/{created.Id}", ProposalResponse.From(created));
        }).ConfigureAwait(false);
    }
}
