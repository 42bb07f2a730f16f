using System.Text.Json;
using CapReview.Engine.Evaluation;
using CapReview.Engine.Specifications;
using CapReview.Engine.Validation;

namespace CapReview.Web.Api;

/// <summary>POST /api/v1/evaluations: evaluates a model and stores nothing.</summary>
public static class EvaluationEndpoints
{
    /// <summary>Largest request body accepted: enough for the largest model.</summary>
    public const long MaxRequestBytes = 1_000_000;

    public static IEndpointRouteBuilder MapEvaluationEndpoints(this IEndpointRouteBuilder routes)
    {
        routes.MapPost("/api/v1/evaluations", EvaluateAsync)
            .WithName("CreateEvaluation")
            .WithSummary("Evaluate a cash-flow model at a MARR")
            .WithDescription("Returns every measure of worth; with a tax block, the after-tax flows, depreciation and measures beside them. Stores nothing. Invalid input returns RFC 9457 problem details naming each bad field.")
            .Accepts<ModelSpec>("application/json")
            .Produces<EvaluationResponse>()
            .ProducesValidationProblem()
            .Produces(StatusCodes.Status401Unauthorized)
            .RequireAuthorization(Identity.IdentityRegistration.Api)
            .DisableAntiforgery();
        return routes;
    }

    private static async Task<IResult> EvaluateAsync(HttpRequest request, Operations.CapReviewMetrics metrics, CancellationToken cancellationToken)
    {
        if (request.ContentLength > MaxRequestBytes)
        {
            return Problem("body", $"The request is larger than {MaxRequestBytes:N0} bytes.");
        }
        if (!request.HasJsonContentType())
        {
            return Problem("body", "Send the model as application/json.");
        }
        byte[]? body = await JsonBody.ReadAsync(request, MaxRequestBytes, cancellationToken).ConfigureAwait(false);
        if (body is null)
        {
            return Problem("body", $"The request is larger than {MaxRequestBytes:N0} bytes.");
        }
        ModelSpec? spec;
        TaxSpec? tax;
        try
        {
            // The model's fields and the optional tax block sit side by side in one object.
            spec = JsonSerializer.Deserialize<ModelSpec>(body, ApiJson.Options);
            tax = spec is null ? null : JsonSerializer.Deserialize<TaxBlock>(body, ApiJson.Options)?.Tax;
        }
        catch (JsonException ex)
        {
            return Problem(FieldOf(ex.Path), FiniteNumberConverter.Refusal(ex));
        }
        if (spec is null)
        {
            return Problem("body", "Send a model object.");
        }
        long started = System.Diagnostics.Stopwatch.GetTimestamp();
        IResult result = tax is null ? BeforeTax(spec) : AfterTax(spec, tax);
        metrics.Evaluated(System.Diagnostics.Stopwatch.GetElapsedTime(started));
        return result;
    }

    private static IResult BeforeTax(ModelSpec spec)
    {
        Outcome<Evaluation> outcome = Evaluator.Evaluate(spec);
        return outcome.IsValid ? Results.Ok(EvaluationResponse.From(outcome.Value!)) : Invalid(outcome.Errors);
    }

    private static IResult AfterTax(ModelSpec spec, TaxSpec tax)
    {
        Outcome<AfterTaxEvaluation> outcome = AfterTaxEvaluator.Evaluate(spec, tax);
        return outcome.IsValid
            ? Results.Ok(EvaluationResponse.From(outcome.Value!.BeforeTax) with { AfterTax = AfterTaxResponse.From(outcome.Value) })
            : Invalid(outcome.Errors);
    }

    internal static IResult Invalid(IReadOnlyList<InputError> errors, string title = "The model has invalid input.") => ApiProblems.Invalid(errors, title);

    private static IResult Problem(string field, string message) => ApiProblems.Invalid(field, message, "The request could not be read.");

    /// <summary>"$.elements[2].amount" → "elements[2].amount".</summary>
    internal static string FieldOf(string? jsonPath) =>
        string.IsNullOrEmpty(jsonPath) || jsonPath == "$" ? "body" : jsonPath.TrimStart('$').TrimStart('.');
}
