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
            .WithDescription("Body: proposalId, outcome (approve, returnForChanges, reject), conditions, version (the version judged), optionally revision. A later submitted version answers 409.")
            .Accepts<DecisionApiRequest>("application/json")
            .Produces<DecisionResponse>(StatusCodes.Status201Created)
            .ProducesValidationProblem()
            .ProducesProblem(StatusCodes.Status403Forbidden)
            .ProducesProblem(StatusCodes.Status404NotFound)
            .ProducesProblem(StatusCodes.Status409Conflict)
            .RequireAuthorization(IdentityRegistration.Api)
            .DisableAntiforgery();
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
            Decision recorded = await decisions.DecideAsync(caller, new DecisionRequest(proposalId, outcome, body.Conditions, id, version, body.Revision), cancellationToken).ConfigureAwait(false);
            DecisionView view = (await decisions.DecisionsAsync(caller, id, cancellationToken).ConfigureAwait(false)).Single(d => d.Id == recorded.Id);
            return Results.Created($"/api/v1/cycles/{id}/decisions", DecisionResponse.From(view));
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
