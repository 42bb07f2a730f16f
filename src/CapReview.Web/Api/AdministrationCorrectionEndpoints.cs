using CapReview.Reviews.Access;
using CapReview.Reviews.Cycles;
using CapReview.Reviews.Marr;
using CapReview.Web.Identity;

namespace CapReview.Web.Api;

/// <summary>
/// An administrator's corrections through the API, with the same services and refusals as the admin pages: a MARR
/// version retired as a mistake, an open cycle's dates and capital limit corrected, a person's roles changed.
/// </summary>
public static class AdministrationCorrectionEndpoints
{
    public static IEndpointRouteBuilder MapAdministrationCorrectionEndpoints(this IEndpointRouteBuilder routes)
    {
        routes.MapPost("/api/v1/marr-policies/{id:int}/retirement", RetireAsync)
            .WithName("RetireMarrPolicy").WithSummary("Retire a MARR policy version entered by mistake (administrators): kept, never pinned by a new cycle")
            .Accepts<RetirementRequest>("application/json").Produces<MarrPolicyResponse>(StatusCodes.Status201Created)
            .ChangesState();
        routes.MapPut("/api/v1/cycles/{id:int}/terms", CorrectCycleAsync)
            .WithName("CorrectCycle").WithSummary("Correct an open cycle's capital limit and dates (administrators)")
            .Accepts<CycleTermsRequest>("application/json").Produces<CycleResponse>()
            .ChangesState();
        routes.MapGet("/api/v1/users", UsersAsync)
            .WithName("ListUsers").WithSummary("Every person who may sign in, with their roles (administrators)")
            .Produces<IReadOnlyList<UserResponse>>().ProducesProblem(StatusCodes.Status403Forbidden)
            .RequireAuthorization(IdentityRegistration.Api);
        routes.MapPut("/api/v1/users/{id}/roles", SetRolesAsync)
            .WithName("SetUserRoles").WithSummary("Give a person these roles (administrators); their sessions end, the last administrator stays one")
            .Accepts<RolesRequest>("application/json").Produces<UserResponse>()
            .ChangesState();
        return routes;
    }

    private static Actor Caller(HttpContext context) => ActorFactory.From(context.User)!;

    private static async Task<IResult> RetireAsync(int id, HttpRequest request, MarrPolicyService policies, CancellationToken cancellationToken)
    {
        var (body, problem) = await ApiBody.ReadAsync<RetirementRequest>(request, "the reason", cancellationToken).ConfigureAwait(false);
        if (body is null)
        {
            return problem!;
        }
        return await ApiProblems.RunAsync(async () =>
        {
            MarrVersionRetirement retirement = await policies.RetireAsync(Caller(request.HttpContext), id, body.Reason ?? "", cancellationToken).ConfigureAwait(false);
            MarrPolicyVersion version = (await policies.FindAsync(id, cancellationToken).ConfigureAwait(false))!;
            return Results.Created("/api/v1/marr-policies", MarrPolicyResponse.From(version, retirement));
        }).ConfigureAwait(false);
    }

    private static async Task<IResult> CorrectCycleAsync(int id, HttpRequest request, CycleService cycles, CancellationToken cancellationToken)
    {
        var (body, problem) = await ApiBody.ReadAsync<CycleTermsRequest>(request, "the cycle's terms", cancellationToken).ConfigureAwait(false);
        if (body is null)
        {
            return problem!;
        }
        if (body.CapitalLimit is not decimal limit)
        {
            return ApiProblems.Invalid("capitalLimit", "Give the capital the cycle may commit.");
        }
        if (body.OpensOn is not DateOnly opens || body.ClosesOn is not DateOnly closes)
        {
            return ApiProblems.Invalid(body.OpensOn is null ? "opensOn" : "closesOn", "Give the dates the cycle opens and closes (yyyy-mm-dd).");
        }
        if (body.Revision is not int revision)
        {
            return ApiProblems.Invalid("revision", "Send the cycle's revision you started from (GET /api/v1/cycles/{id}).");
        }
        return await ApiProblems.RunAsync(async () => Results.Ok(CycleResponse.From(
            await cycles.CorrectAsync(Caller(request.HttpContext), id, new CycleCorrection(limit, opens, closes), revision, cancellationToken).ConfigureAwait(false)))).ConfigureAwait(false);
    }

    private static Task<IResult> UsersAsync(HttpContext context, UserAdministration users, CancellationToken cancellationToken) =>
        ApiProblems.RunAsync(async () => Results.Ok((await users.ListAsync(Caller(context), cancellationToken).ConfigureAwait(false)).Select(UserResponse.From).ToList()));

    private static async Task<IResult> SetRolesAsync(string id, HttpRequest request, UserAdministration users, CancellationToken cancellationToken)
    {
        var (body, problem) = await ApiBody.ReadAsync<RolesRequest>(request, "the roles", cancellationToken).ConfigureAwait(false);
        if (body is null)
        {
            return problem!;
        }
        if (body.Roles is not { Count: > 0 } roles)
        {
            return ApiProblems.Invalid("roles", "Give at least one role: projectLead, reviewer, finance or administrator.");
        }
        return await ApiProblems.RunAsync(async () =>
        {
            Actor caller = Caller(request.HttpContext);
            await users.SetRolesAsync(caller, id, [.. roles.Select(r => r.ToString())]).ConfigureAwait(false);
            return Results.Ok(UserResponse.From((await users.ListAsync(caller, cancellationToken).ConfigureAwait(false)).Single(u => u.Id == id)));
        }).ConfigureAwait(false);
    }
}
