using System.Text.Json;
using CapReview.Engine.Risk;
using CapReview.Reviews.Risk;

namespace CapReview.Web.Api;

/// <summary>POST /api/v1/risk-analyses: a model's tornado, spider, break-even values, scenarios and seeded simulation; stores nothing.</summary>
public static class RiskAnalysisEndpoints
{
    public static IEndpointRouteBuilder MapRiskAnalysisEndpoints(this IEndpointRouteBuilder routes)
    {
        routes.MapPost("/api/v1/risk-analyses", AnalyseAsync)
            .WithName("CreateRiskAnalysis")
            .WithSummary("Analyse the risk of a cash-flow model")
            .WithDescription("Returns the tornado, spider, break-even values, scenarios and the Monte Carlo summary of present worth, the same for the same seed. Stores nothing. Invalid input, or more trials than the limit, returns RFC 9457 problem details naming each bad field.")
            .Accepts<RiskAnalysisRequest>("application/json")
            .Produces<RiskAnalysisResponse>()
            .ProducesValidationProblem()
            .Produces(StatusCodes.Status401Unauthorized)
            .ProducesProblem(StatusCodes.Status429TooManyRequests)
            .RequireAuthorization(Identity.IdentityRegistration.Api)
            .DisableAntiforgery();
        return routes;
    }

    private static async Task<IResult> AnalyseAsync(HttpRequest request, RiskRuns runs, CancellationToken cancellationToken)
    {
        if (request.ContentLength > EvaluationEndpoints.MaxRequestBytes)
        {
            return ApiProblems.Invalid("body", $"The request is larger than {EvaluationEndpoints.MaxRequestBytes:N0} bytes.");
        }
        if (!request.HasJsonContentType())
        {
            return ApiProblems.Invalid("body", "Send the model and its risk settings as application/json.");
        }
        byte[]? bytes = await JsonBody.ReadAsync(request, EvaluationEndpoints.MaxRequestBytes, cancellationToken).ConfigureAwait(false);
        if (bytes is null)
        {
            return ApiProblems.Invalid("body", $"The request is larger than {EvaluationEndpoints.MaxRequestBytes:N0} bytes.");
        }
        RiskAnalysisRequest? body;
        try
        {
            body = JsonSerializer.Deserialize<RiskAnalysisRequest>(bytes, ApiJson.Options);
        }
        catch (JsonException ex)
        {
            return ApiProblems.Invalid(EvaluationEndpoints.FieldOf(ex.Path), FiniteNumberConverter.Refusal(ex));
        }
        if (body?.Model is null)
        {
            return ApiProblems.Invalid("model", "Send the model to analyse: its horizon, rate and elements.");
        }
        if (body.Risk is null)
        {
            return ApiProblems.Invalid("risk", "Send the risk settings: at least one uncertain parameter.");
        }
        var proposal = new ProposalCase(body.Model, body.Tax);
        if (proposal.Evaluate() is { IsValid: false } invalid)
        {
            // The model's own fields are named under "model", as in a proposal version's assumptions.
            return EvaluationEndpoints.Invalid([.. invalid.Errors.Select(e => e.Field.StartsWith("tax", StringComparison.Ordinal) ? e : e with { Field = "model." + e.Field })]);
        }
        var prepared = ProposalRisk.Prepare(proposal, body.Risk);
        if (prepared.Value is not { } study)
        {
            return EvaluationEndpoints.Invalid(prepared.Errors, "The risk settings have invalid input.");
        }
        // The simulation is one of the caller's runs: over the work budget it is refused naming risk.trials (400), beyond
        // the caller's or the server's runs at once with 429; an abandoned request stops it between trials.
        return await ApiProblems.RunAsync(async () =>
        {
            var simulation = await runs.SimulateAsync(Identity.ActorFactory.From(request.HttpContext.User)!, study, progress: null, cancellationToken).ConfigureAwait(false);
            var sensitivity = ProposalRisk.Analyse(study, body.Measure ?? RiskMeasure.PresentWorth);
            return Results.Ok(RiskAnalysisResponse.From(study, sensitivity, simulation));
        }).ConfigureAwait(false);
    }
}
