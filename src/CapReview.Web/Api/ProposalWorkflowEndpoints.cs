using CapReview.Reviews.Access;
using CapReview.Reviews.Comments;
using CapReview.Reviews.Proposals;
using CapReview.Web.Identity;

namespace CapReview.Web.Api;

/// <summary>
/// A lead's part of the workflow through the API, with the same services and refusals as the proposal page: change a
/// draft version, revise after a frozen one, submit to a cycle, withdraw; and the discussion of a proposal.
/// </summary>
public static class ProposalWorkflowEndpoints
{
    public static IEndpointRouteBuilder MapProposalWorkflowEndpoints(this IEndpointRouteBuilder routes)
    {
        routes.MapPut("/api/v1/proposals/{id:int}/versions/{number:int}", EditDraftAsync)
            .WithName("EditDraftVersion")
            .WithSummary("Change the assumptions of the proposal's draft version (its lead)")
            .WithDescription("Body: revision (the proposal's, from GET), assumptions. A frozen version is refused: revise instead.")
            .Accepts<DraftEditRequest>("application/json")
            .Produces<ProposalResponse>()
            .ChangesState();
        routes.MapPost("/api/v1/proposals/{id:int}/versions", ReviseAsync)
            .WithName("ReviseProposal")
            .WithSummary("Start a new draft version after a frozen one (its lead: once returned for changes, or as a pending revision while the board has it and the cycle is undecided)")
            .Accepts<RevisionRequest>("application/json")
            .Produces<ProposalResponse>(StatusCodes.Status201Created)
            .ChangesState();
        routes.MapPost("/api/v1/proposals/{id:int}/submissions", SubmitAsync)
            .WithName("SubmitProposal")
            .WithSummary("Submit the latest version to a cycle, which freezes it (its lead)")
            .Accepts<SubmissionRequest>("application/json")
            .Produces<ProposalResponse>()
            .ChangesState();
        routes.MapPost("/api/v1/proposals/{id:int}/withdrawals", WithdrawAsync)
            .WithName("WithdrawProposal")
            .WithSummary("Withdraw a draft, submitted or returned proposal (its lead)")
            .Accepts<WithdrawalRequest>("application/json")
            .Produces<ProposalResponse>()
            .ChangesState();
        routes.MapGet("/api/v1/proposals/{id:int}/comments", CommentsAsync)
            .WithName("ListComments")
            .WithSummary("The discussion of a proposal, oldest first")
            .Produces<IReadOnlyList<CommentResponse>>()
            .ProducesProblem(StatusCodes.Status404NotFound)
            .RequireAuthorization(IdentityRegistration.Api);
        routes.MapPost("/api/v1/proposals/{id:int}/comments", CommentAsync)
            .WithName("AddComment")
            .WithSummary("Add to the discussion (the proposal's lead and board members)")
            .Accepts<CommentRequest>("application/json")
            .Produces<CommentResponse>(StatusCodes.Status201Created)
            .ProducesValidationProblem()
            .ProducesProblem(StatusCodes.Status403Forbidden)
            .ProducesProblem(StatusCodes.Status404NotFound)
            .RequireAuthorization(IdentityRegistration.Api)
            .DisableAntiforgery();
        return routes;
    }

    private static Actor Caller(HttpContext context) => ActorFactory.From(context.User)!;

    private static async Task<IResult> EditDraftAsync(int id, int number, HttpRequest request, ProposalService proposals, CancellationToken cancellationToken)
    {
        var (body, problem) = await ApiBody.ReadAsync<DraftEditRequest>(request, "the draft's assumptions", cancellationToken).ConfigureAwait(false);
        if (body is null)
        {
            return problem!;
        }
        if (body.Revision is not int revision)
        {
            return MissingRevision();
        }
        return await ApiProblems.RunAsync(async () => Results.Ok(ProposalResponse.From(
            await proposals.EditDraftAsync(Caller(request.HttpContext), id, number, revision, body.Assumptions!, cancellationToken).ConfigureAwait(false)))).ConfigureAwait(false);
    }

    private static async Task<IResult> ReviseAsync(int id, HttpRequest request, ProposalService proposals, CancellationToken cancellationToken)
    {
        var (body, problem) = await ApiBody.ReadAsync<RevisionRequest>(request, "the new version", cancellationToken).ConfigureAwait(false);
        if (body is null)
        {
            return problem!;
        }
        if (body.Revision is not int revision)
        {
            return MissingRevision();
        }
        return await ApiProblems.RunAsync(async () =>
        {
            ProposalView revised = await proposals.ReviseAsync(Caller(request.HttpContext), id, revision, body.Assumptions!, body.Reason ?? "", cancellationToken).ConfigureAwait(false);
            return Results.Created($"/api/v1/proposals/{id}/versions/{revised.Latest.Number}", ProposalResponse.From(revised));
        }).ConfigureAwait(false);
    }

    private static async Task<IResult> SubmitAsync(int id, HttpRequest request, ProposalService proposals, CancellationToken cancellationToken)
    {
        var (body, problem) = await ApiBody.ReadAsync<SubmissionRequest>(request, "the submission", cancellationToken).ConfigureAwait(false);
        if (body is null)
        {
            return problem!;
        }
        if (body.CycleId is not int cycleId)
        {
            return ApiProblems.Invalid("cycleId", "Name the cycle to submit to (its id, from GET /api/v1/cycles).");
        }
        if (body.Revision is not int revision)
        {
            return MissingRevision();
        }
        return await ApiProblems.RunAsync(async () => Results.Ok(ProposalResponse.From(
            await proposals.SubmitAsync(Caller(request.HttpContext), id, cycleId, revision, cancellationToken).ConfigureAwait(false)))).ConfigureAwait(false);
    }

    private static async Task<IResult> WithdrawAsync(int id, HttpRequest request, ProposalService proposals, CancellationToken cancellationToken)
    {
        var (body, problem) = await ApiBody.ReadAsync<WithdrawalRequest>(request, "the withdrawal", cancellationToken).ConfigureAwait(false);
        if (body is null)
        {
            return problem!;
        }
        if (body.Revision is not int revision)
        {
            return MissingRevision();
        }
        return await ApiProblems.RunAsync(async () => Results.Ok(ProposalResponse.From(
            await proposals.WithdrawAsync(Caller(request.HttpContext), id, revision, cancellationToken).ConfigureAwait(false)))).ConfigureAwait(false);
    }

    private static Task<IResult> CommentsAsync(int id, HttpContext context, CommentService comments, CancellationToken cancellationToken) =>
        ApiProblems.RunAsync(async () => Results.Ok((await comments.ListAsync(Caller(context), id, cancellationToken).ConfigureAwait(false))
            .Select(CommentResponse.From).ToList()));

    private static async Task<IResult> CommentAsync(int id, HttpRequest request, CommentService comments, CancellationToken cancellationToken)
    {
        var (body, problem) = await ApiBody.ReadAsync<CommentRequest>(request, "the comment", cancellationToken).ConfigureAwait(false);
        if (body is null)
        {
            return problem!;
        }
        return await ApiProblems.RunAsync(async () =>
        {
            ProposalComment added = await comments.AddAsync(Caller(request.HttpContext), id, body.Text ?? "", cancellationToken).ConfigureAwait(false);
            return Results.Created($"/api/v1/proposals/{id}/comments", CommentResponse.From(added));
        }).ConfigureAwait(false);
    }

    internal static IResult MissingRevision() =>
        ApiProblems.Invalid("revision", "Send the revision you started from (the proposal's revision in GET /api/v1/proposals/{id}).");
}
