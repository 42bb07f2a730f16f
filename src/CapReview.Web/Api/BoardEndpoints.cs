using CapReview.Reviews.Access;
using CapReview.Reviews.Decisions;
using CapReview.Reviews.Records;
using CapReview.Web.Identity;

namespace CapReview.Web.Api;

/// <summary>
/// The board's part through the API, with the same services and refusals as the cycle page: decisions on the version
/// judged, sign-offs (the last required one decides the cycle and queues its packets), and the packet job.
/// </summary>
public static class BoardEndpoints
{
    public static IEndpointRouteBuilder MapBoardEndpoints(this IEndpointRouteBuilder routes)
    {
        routes.MapGet("/api/v1/cycles/{id:int}/decisions", DecisionsAsync)
            .WithName("ListDecisions")
            .WithSummary("The cycle's decisions in the order they were made, on the proposals the caller may see")
            .Produces<IReadOnlyList<DecisionResponse>>()
            .ProducesProblem(StatusCodes.Status404NotFound)
            .RequireAuthorization(IdentityRegistration.Api);
        routes.MapPost("/api/v1/cycles/{id:int}/decisions", DecideAsync)
            .WithName("RecordDecision")
            .WithSummary("Record a board member's decision on the version they judged")
            .WithDescription("Body: proposalId, outcome (approve, returnForChanges, reject), conditions, version (the version judged), optionally revision. A later submitted version answers 409. " +
                "An approval or rejection can be changed until the cycle is signed off, to the other or to returnForChanges (the proposal goes back to its lead): the new decision supersedes the old. A decision that breaks the board's portfolio rules (a capital limit, " +
                "an exclusive or mandatory group, a prerequisite) answers 400 naming the rule, unless override is true with an overrideReason.")
            .Accepts<DecisionApiRequest>("application/json")
            .Produces<DecisionResponse>(StatusCodes.Status201Created)
            .ChangesState();
        routes.MapGet("/api/v1/cycles/{id:int}/decisions/portfolio", PortfolioPlanAsync)
            .WithName("ListPortfolioApprovals")
            .WithSummary("The approvals the selected portfolio still needs, for a board member to confirm")
            .Produces<IReadOnlyList<PortfolioApprovalResponse>>()
            .ProducesValidationProblem()
            .ProducesProblem(StatusCodes.Status403Forbidden)
            .ProducesProblem(StatusCodes.Status404NotFound)
            .RequireAuthorization(IdentityRegistration.Api);
        routes.MapPost("/api/v1/cycles/{id:int}/decisions/portfolio", ApprovePortfolioAsync)
            .WithName("ApprovePortfolio")
            .WithSummary("Approve the selected portfolio in one step: the confirmed proposals, exactly as the selection lists them")
            .WithDescription("Body: proposalIds (as GET lists them), optionally override and overrideReason. A selection that changed since answers 409 and records nothing; " +
                "approvals that break the board's rules beside the decisions already recorded answer 400 naming the rule, unless override is true with an overrideReason.")
            .Accepts<PortfolioApprovalRequest>("application/json")
            .Produces<IReadOnlyList<DecisionResponse>>(StatusCodes.Status201Created)
            .ChangesState();
        routes.MapGet("/api/v1/cycles/{id:int}/sign-offs", SignOffsAsync)
            .WithName("ListSignOffs")
            .WithSummary("The cycle's sign-offs and the decisions each covered (board, finance, administrators)")
            .Produces<IReadOnlyList<SignOffResponse>>()
            .ProducesProblem(StatusCodes.Status403Forbidden)
            .ProducesProblem(StatusCodes.Status404NotFound)
            .RequireAuthorization(IdentityRegistration.Api);
        routes.MapPost("/api/v1/cycles/{id:int}/sign-offs", SignOffAsync)
            .WithName("SignOffCycle")
            .WithSummary("Sign off the cycle's decisions (board members); the last required sign-off decides the cycle and queues its packets")
            .Produces<SignOffResponse>(StatusCodes.Status201Created)
            .ProducesValidationProblem()
            .ProducesProblem(StatusCodes.Status403Forbidden)
            .ProducesProblem(StatusCodes.Status404NotFound)
            .RequireAuthorization(IdentityRegistration.Api)
            .DisableAntiforgery();
        routes.MapGet("/api/v1/cycles/{id:int}/packet-job", PacketJobAsync)
            .WithName("GetPacketJob")
            .WithSummary("Where the making of a decided cycle's packets stands: queued, running, done or failed, with the last error")
            .Produces<PacketJobResponse>()
            .ProducesProblem(StatusCodes.Status403Forbidden)
            .ProducesProblem(StatusCodes.Status404NotFound)
            .RequireAuthorization(IdentityRegistration.Api);
        routes.MapPost("/api/v1/cycles/{id:int}/packet-job", RequestPacketsAsync)
            .WithName("RequestPackets")
            .WithSummary("Ask again for a decided cycle's missing packets (board, finance, administrators)")
            .Produces<PacketJobResponse>(StatusCodes.Status202Accepted)
            .ProducesValidationProblem()
            .ProducesProblem(StatusCodes.Status403Forbidden)
            .ProducesProblem(StatusCodes.Status404NotFound)
            .RequireAuthorization(IdentityRegistration.Api)
            .DisableAntiforgery();
        return routes;
    }

    private static Actor Caller(HttpContext context) => ActorFactory.From(context.User)!;

    private static Task<IResult> DecisionsAsync(int id, HttpContext context, DecisionService decisions, CancellationToken cancellationToken) =>
        ApiProblems.RunAsync(async () => Results.Ok((await decisions.DecisionsAsync(Caller(context), id, cancellationToken).ConfigureAwait(false))
            .Select(DecisionResponse.From).ToList()));

    private static async Task<IResult> DecideAsync(int id, HttpRequest request, DecisionService decisions, CancellationToken cancellationToken)
    {
        var (body, problem) = await ApiBody.ReadAsync<DecisionApiRequest>(request, "the decision", cancellationToken).ConfigureAwait(false);
        if (body is null)
        {
            return problem!;
        }
        if (body.ProposalId is not int proposalId)
        {
            return ApiProblems.Invalid("proposalId", "Name the proposal decided (its id).");
        }
        if (body.Outcome is not DecisionOutcome outcome)
        {
            return ApiProblems.Invalid("outcome", "Choose approve, returnForChanges or reject.");
        }
        if (body.Version is not int version)
        {
            return ApiProblems.Invalid("version", "Name the version you judged (its number), so that the decision is recorded on that version only.");
        }
        Actor caller = Caller(request.HttpContext);
        return await ApiProblems.RunAsync(async () =>
        {
            Decision recorded = await decisions.DecideAsync(caller,
                new DecisionRequest(proposalId, outcome, body.Conditions, id, version, body.Revision, body.Override == true, body.OverrideReason), cancellationToken).ConfigureAwait(false);
            DecisionView view = (await decisions.DecisionsAsync(caller, id, cancellationToken).ConfigureAwait(false)).Single(d => d.Id == recorded.Id);
            return Results.Created($"/api/v1/cycles/{id}/decisions", DecisionResponse.From(view));
        }).ConfigureAwait(false);
    }

    private static Task<IResult> PortfolioPlanAsync(int id, HttpContext context, PortfolioApprovalService approvals, CancellationToken cancellationToken) =>
        ApiProblems.RunAsync(async () => Results.Ok((await approvals.PlanAsync(Caller(context), id, cancellationToken).ConfigureAwait(false))
            .Select(PortfolioApprovalResponse.From).ToList()));

    private static async Task<IResult> ApprovePortfolioAsync(int id, HttpRequest request, PortfolioApprovalService approvals, DecisionService decisions, CancellationToken cancellationToken)
    {
        var (body, problem) = await ApiBody.ReadAsync<PortfolioApprovalRequest>(request, "the approvals", cancellationToken).ConfigureAwait(false);
        if (body is null)
        {
            return problem!;
        }
        if (body.ProposalIds is not { Count: > 0 } confirmed)
        {
            return ApiProblems.Invalid("proposalIds", "List the proposals you confirm (their ids, as the selected portfolio lists them).");
        }
        Actor caller = Caller(request.HttpContext);
        return await ApiProblems.RunAsync(async () =>
        {
            var recorded = await approvals.ApproveAsync(caller, id, [.. confirmed], body.Override == true, body.OverrideReason, cancellationToken).ConfigureAwait(false);
            var ids = recorded.Select(d => d.Id).ToHashSet();
            var views = (await decisions.DecisionsAsync(caller, id, cancellationToken).ConfigureAwait(false)).Where(d => ids.Contains(d.Id));
            return Results.Created($"/api/v1/cycles/{id}/decisions", views.Select(DecisionResponse.From).ToList());
        }).ConfigureAwait(false);
    }

    private static Task<IResult> SignOffsAsync(int id, HttpContext context, DecisionService decisions, CancellationToken cancellationToken) =>
        ApiProblems.RunAsync(async () => Results.Ok(SignOffResponse.All(await decisions.SignOffsAsync(Caller(context), id, cancellationToken).ConfigureAwait(false))));

    private static Task<IResult> SignOffAsync(int id, HttpContext context, DecisionService decisions, CancellationToken cancellationToken) =>
        ApiProblems.RunAsync(async () => Results.Created($"/api/v1/cycles/{id}/sign-offs",
            SignOffResponse.From(await decisions.SignOffAsync(Caller(context), id, cancellationToken).ConfigureAwait(false), "current")));

    private static Task<IResult> PacketJobAsync(int id, HttpContext context, PacketJobs jobs, CancellationToken cancellationToken) =>
        ApiProblems.RunAsync(async () =>
        {
            PacketJobView job = await jobs.StatusAsync(Caller(context), id, cancellationToken).ConfigureAwait(false)
                ?? throw new Reviews.Common.NotFoundException("No packets have been asked for in this cycle: it is not decided by its sign-offs.");
            return Results.Ok(PacketJobResponse.From(job));
        });

    private static Task<IResult> RequestPacketsAsync(int id, HttpContext context, PacketJobs jobs, CancellationToken cancellationToken) =>
        ApiProblems.RunAsync(async () => Results.Accepted($"/api/v1/cycles/{id}/packet-job",
            PacketJobResponse.From(await jobs.RequestAsync(Caller(context), id, cancellationToken).ConfigureAwait(false))));
}
