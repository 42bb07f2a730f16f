using CapReview.Reviews.Access;
using CapReview.Reviews.Cycles;
using CapReview.Reviews.Marr;
using CapReview.Reviews.Portfolio;
using CapReview.Web.Identity;

namespace CapReview.Web.Api;

/// <summary>
/// The administrators' and the board's set-up through the API, with the same services and refusals as the admin and
/// portfolio pages: MARR policy versions, budget cycles and their moves, and each cycle's portfolio rules.
/// </summary>
public static class AdministrationEndpoints
{
    public static IEndpointRouteBuilder MapAdministrationEndpoints(this IEndpointRouteBuilder routes)
    {
        routes.MapGet("/api/v1/marr-policies", PoliciesAsync)
            .WithName("ListMarrPolicies").WithSummary("The MARR policy versions, oldest first")
            .Produces<IReadOnlyList<MarrPolicyResponse>>()
            .RequireAuthorization(IdentityRegistration.Api);
        routes.MapPost("/api/v1/marr-policies", AddPolicyAsync)
            .WithName("AddMarrPolicy").WithSummary("Add a MARR policy version (administrators); versions are never changed")
            .Accepts<NewMarrPolicyRequest>("application/json").Produces<MarrPolicyResponse>(StatusCodes.Status201Created)
            .ChangesState();
        routes.MapPost("/api/v1/cycles", CreateCycleAsync)
            .WithName("CreateCycle").WithSummary("Open a budget cycle pinned to a MARR policy version (administrators)")
            .Accepts<NewCycleRequest>("application/json").Produces<CycleResponse>(StatusCodes.Status201Created)
            .ChangesState();
        routes.MapGet("/api/v1/cycles/{id:int}", CycleAsync)
            .WithName("GetCycle").WithSummary("One budget cycle, with its revision")
            .Produces<CycleResponse>().ProducesProblem(StatusCodes.Status404NotFound)
            .RequireAuthorization(IdentityRegistration.Api);
        routes.MapPut("/api/v1/cycles/{id:int}/status", MoveCycleAsync)
            .WithName("MoveCycle").WithSummary("Start a cycle's review (inReview) or close a decided cycle (closed) (administrators)")
            .Accepts<CycleStatusRequest>("application/json").Produces<CycleResponse>()
            .ChangesState();
        routes.MapGet("/api/v1/cycles/{id:int}/portfolio-rules", RulesAsync)
            .WithName("GetPortfolioRules").WithSummary("A cycle's plan, exclusive groups and contingencies (board, finance, administrators)")
            .Produces<PortfolioRulesResponse>().ProducesProblem(StatusCodes.Status403Forbidden).ProducesProblem(StatusCodes.Status404NotFound)
            .RequireAuthorization(IdentityRegistration.Api);
        routes.MapPut("/api/v1/cycles/{id:int}/plan", SetPlanAsync)
            .WithName("SetCyclePlan").WithSummary("Set the cycle's study period, later budget years' limits and objective (board, administrators)")
            .Accepts<CyclePlanRequest>("application/json").Produces<PortfolioRulesResponse>()
            .ChangesState();
        routes.MapPost("/api/v1/cycles/{id:int}/groups", SaveGroupAsync)
            .WithName("SaveExclusiveGroup").WithSummary("Add an exclusive group, or replace the one of the same name (board, administrators)")
            .Accepts<GroupRequest>("application/json").Produces<PortfolioRulesResponse>()
            .ChangesState();
        routes.MapDelete("/api/v1/cycles/{id:int}/groups/{groupId:int}", RemoveGroupAsync)
            .WithName("RemoveExclusiveGroup").WithSummary("Remove an exclusive group (board, administrators)")
            .Produces<PortfolioRulesResponse>()
            .ChangesState();
        routes.MapPost("/api/v1/cycles/{id:int}/contingencies", AddContingencyAsync)
            .WithName("AddContingency").WithSummary("Fund a proposal only with its prerequisite (board, administrators)")
            .Accepts<ContingencyRequest>("application/json").Produces<PortfolioRulesResponse>()
            .ChangesState();
        routes.MapDelete("/api/v1/cycles/{id:int}/contingencies/{contingencyId:int}", RemoveContingencyAsync)
            .WithName("RemoveContingency").WithSummary("Remove a contingency (board, administrators)")
            .Produces<PortfolioRulesResponse>()
            .ChangesState();
        return routes;
    }

    private static Actor Caller(HttpContext context) => ActorFactory.From(context.User)!;

    private static async Task<IResult> PoliciesAsync(MarrPolicyService policies, CancellationToken cancellationToken)
    {
        var retired = await policies.RetirementsAsync(cancellationToken).ConfigureAwait(false);
        return Results.Ok((await policies.ListAsync(cancellationToken).ConfigureAwait(false)).Select(m => MarrPolicyResponse.From(m, retired.GetValueOrDefault(m.Id))).ToList());
    }

    private static async Task<IResult> AddPolicyAsync(HttpRequest request, MarrPolicyService policies, CancellationToken cancellationToken)
    {
        var (body, problem) = await ApiBody.ReadAsync<NewMarrPolicyRequest>(request, "the MARR policy", cancellationToken).ConfigureAwait(false);
        if (body is null)
        {
            return problem!;
        }
        if (body.Rate is not double rate)
        {
            return ApiProblems.Invalid("rate", "Give the MARR as a fraction (0.08 is 8 %).");
        }
        if (body.EffectiveFrom is not DateOnly from)
        {
            return ApiProblems.Invalid("effectiveFrom", "Give the date the policy takes effect (yyyy-mm-dd).");
        }
        var policy = new NewMarrPolicy(rate, body.Basis ?? Engine.Rates.RateBasis.Effective, body.CompoundingsPerYear ?? 1, from, body.Reason ?? "",
            body.LowRiskPremium ?? 0, body.StandardRiskPremium ?? 0, body.HighRiskPremium ?? 0, body.InflationRate ?? 0, body.RealMarr ?? false, body.AfterTaxRate);
        return await ApiProblems.RunAsync(async () =>
        {
            MarrPolicyVersion added = await policies.AddVersionAsync(Caller(request.HttpContext), policy, cancellationToken).ConfigureAwait(false);
            return Results.Created($"/api/v1/marr-policies", MarrPolicyResponse.From(added, null));
        }).ConfigureAwait(false);
    }

    private static async Task<IResult> CreateCycleAsync(HttpRequest request, CycleService cycles, CancellationToken cancellationToken)
    {
        var (body, problem) = await ApiBody.ReadAsync<NewCycleRequest>(request, "the cycle", cancellationToken).ConfigureAwait(false);
        if (body is null)
        {
            return problem!;
        }
        if (body.CapitalLimit is not decimal limit)
        {
            return ApiProblems.Invalid("capitalLimit", "Give the capital the cycle may commit.");
        }
        if (body.MarrPolicyVersionId is not int marr)
        {
            return ApiProblems.Invalid("marrPolicyVersionId", "Name the MARR policy version the cycle is pinned to (its id).");
        }
        if (body.OpensOn is not DateOnly opens || body.ClosesOn is not DateOnly closes)
        {
            return ApiProblems.Invalid(body.OpensOn is null ? "opensOn" : "closesOn", "Give the dates the cycle opens and closes (yyyy-mm-dd).");
        }
        var cycle = new NewBudgetCycle(body.Name ?? "", limit, marr, opens, closes, body.RequiredSignOffs ?? 2);
        return await ApiProblems.RunAsync(async () =>
        {
            BudgetCycle created = await cycles.CreateAsync(Caller(request.HttpContext), cycle, cancellationToken).ConfigureAwait(false);
            return Results.Created($"/api/v1/cycles/{created.Id}", CycleResponse.From(created));
        }).ConfigureAwait(false);
    }

    private static Task<IResult> CycleAsync(int id, CycleService cycles, CancellationToken cancellationToken) =>
        ApiProblems.RunAsync(async () => Results.Ok(CycleResponse.From((await cycles.GetAsync(id, cancellationToken).ConfigureAwait(false)).Cycle)));

    private static async Task<IResult> MoveCycleAsync(int id, HttpRequest request, CycleService cycles, CancellationToken cancellationToken)
    {
        var (body, problem) = await ApiBody.ReadAsync<CycleStatusRequest>(request, "the cycle's new status", cancellationToken).ConfigureAwait(false);
        if (body is null)
        {
            return problem!;
        }
        if (body.Status is not CycleStatus to)
        {
            return ApiProblems.Invalid("status", "Give the status to move to: inReview or closed.");
        }
        if (body.Revision is not int revision)
        {
            return ApiProblems.Invalid("revision", "Send the cycle's revision you started from (GET /api/v1/cycles/{id}).");
        }
        return await ApiProblems.RunAsync(async () => Results.Ok(CycleResponse.From(
            await cycles.MoveAsync(Caller(request.HttpContext), id, to, revision, cancellationToken).ConfigureAwait(false)))).ConfigureAwait(false);
    }

    private static Task<IResult> RulesAsync(int id, HttpContext context, CycleService cycles, PortfolioRulesService rules, CancellationToken cancellationToken) =>
        ApiProblems.RunAsync(() => RulesOfAsync(Caller(context), id, cycles, rules, cancellationToken));

    private static async Task<IResult> RulesOfAsync(Actor caller, int id, CycleService cycles, PortfolioRulesService rules, CancellationToken cancellationToken)
    {
        PortfolioRules current = await rules.GetAsync(caller, id, cancellationToken).ConfigureAwait(false);
        BudgetCycle cycle = (await cycles.GetAsync(id, cancellationToken).ConfigureAwait(false)).Cycle;
        return Results.Ok(PortfolioRulesResponse.From(cycle, current));
    }

    private static async Task<IResult> SetPlanAsync(int id, HttpRequest request, CycleService cycles, PortfolioRulesService rules, CancellationToken cancellationToken)
    {
        var (body, problem) = await ApiBody.ReadAsync<CyclePlanRequest>(request, "the plan", cancellationToken).ConfigureAwait(false);
        if (body is null)
        {
            return problem!;
        }
        if (body.Revision is not int revision)
        {
            return ApiProblems.Invalid("revision", "Send the cycle's revision you started from (GET …/portfolio-rules).");
        }
        Actor caller = Caller(request.HttpContext);
        var plan = new CyclePlan(body.StudyPeriodYears, body.LaterYearLimits ?? [], body.Objective ?? SelectionObjective.PresentWorth);
        return await ApiProblems.RunAsync(async () =>
        {
            await rules.SetPlanAsync(caller, id, plan, revision, cancellationToken).ConfigureAwait(false);
            return await RulesOfAsync(caller, id, cycles, rules, cancellationToken).ConfigureAwait(false);
        }).ConfigureAwait(false);
    }

    private static async Task<IResult> SaveGroupAsync(int id, HttpRequest request, CycleService cycles, PortfolioRulesService rules, CancellationToken cancellationToken)
    {
        var (body, problem) = await ApiBody.ReadAsync<GroupRequest>(request, "the group", cancellationToken).ConfigureAwait(false);
        if (body is null)
        {
            return problem!;
        }
        Actor caller = Caller(request.HttpContext);
        return await ApiProblems.RunAsync(async () =>
        {
            await rules.SaveGroupAsync(caller, id, new GroupDraft(body.Name ?? "", body.Mandatory ?? false, body.ProposalIds ?? []), cancellationToken).ConfigureAwait(false);
            return await RulesOfAsync(caller, id, cycles, rules, cancellationToken).ConfigureAwait(false);
        }).ConfigureAwait(false);
    }

    private static Task<IResult> RemoveGroupAsync(int id, int groupId, HttpContext context, CycleService cycles, PortfolioRulesService rules, CancellationToken cancellationToken) =>
        ApiProblems.RunAsync(async () =>
        {
            Actor caller = Caller(context);
            await rules.RemoveGroupAsync(caller, id, groupId, cancellationToken).ConfigureAwait(false);
            return await RulesOfAsync(caller, id, cycles, rules, cancellationToken).ConfigureAwait(false);
        });

    private static async Task<IResult> AddContingencyAsync(int id, HttpRequest request, CycleService cycles, PortfolioRulesService rules, CancellationToken cancellationToken)
    {
        var (body, problem) = await ApiBody.ReadAsync<ContingencyRequest>(request, "the contingency", cancellationToken).ConfigureAwait(false);
        if (body is null)
        {
            return problem!;
        }
        if (body.DependentProposalId is not int dependent || body.PrerequisiteProposalId is not int prerequisite)
        {
            return ApiProblems.Invalid(body.DependentProposalId is null ? "dependentProposalId" : "prerequisiteProposalId", "Name both proposals by their ids.");
        }
        Actor caller = Caller(request.HttpContext);
        return await ApiProblems.RunAsync(async () =>
        {
            await rules.AddContingencyAsync(caller, id, dependent, prerequisite, cancellationToken).ConfigureAwait(false);
            return await RulesOfAsync(caller, id, cycles, rules, cancellationToken).ConfigureAwait(false);
        }).ConfigureAwait(false);
    }

    private static Task<IResult> RemoveContingencyAsync(int id, int contingencyId, HttpContext context, CycleService cycles, PortfolioRulesService rules, CancellationToken cancellationToken) =>
        ApiProblems.RunAsync(async () =>
        {
            Actor caller = Caller(context);
            await rules.RemoveContingencyAsync(caller, id, contingencyId, cancellationToken).ConfigureAwait(false);
            return await RulesOfAsync(caller, id, cycles, rules, cancellationToken).ConfigureAwait(false);
        });
}
