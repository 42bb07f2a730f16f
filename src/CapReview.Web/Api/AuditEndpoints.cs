using System.Globalization;
using CapReview.Reviews.Audit;
using CapReview.Web.Exports;
using CapReview.Web.Identity;

namespace CapReview.Web.Api;

/// <summary>
/// The audit trail for administrators, filtered by proposal (its reference), person (their user id) and days (UTC,
/// both included): as JSON, and as the CSV the audit page downloads, from the same search.
/// </summary>
public static class AuditEndpoints
{
    public static IEndpointRouteBuilder MapAuditEndpoints(this IEndpointRouteBuilder routes)
    {
        routes.MapGet("/api/v1/audit-events", EventsAsync)
            .WithName("ListAuditEvents").WithSummary("The audit trail, newest first, filtered by proposal, person and days (administrators)")
            .Produces<AuditEventsResponse>().ProducesValidationProblem().ProducesProblem(StatusCodes.Status403Forbidden)
            .RequireAuthorization(IdentityRegistration.Api);
        routes.MapGet("/api/v1/audit-events/csv", CsvAsync)
            .WithName("ExportAuditEvents").WithSummary("The filtered audit trail as a CSV table (administrators)")
            .Produces(StatusCodes.Status200OK, contentType: "text/csv").ProducesValidationProblem().ProducesProblem(StatusCodes.Status403Forbidden)
            .RequireAuthorization(IdentityRegistration.Api);
        return routes;
    }

    private static Task<IResult> EventsAsync(HttpContext context, AuditSearch search, string? proposal, string? person, string? from, string? to, string? limit, CancellationToken cancellationToken)
    {
        int count = 100;
        if (limit is not null && (!int.TryParse(limit, NumberStyles.None, CultureInfo.InvariantCulture, out count) || count is < 1 or > 1000))
        {
            return Task.FromResult(ApiProblems.Invalid("limit", "Give how many events to list, from 1 to 1000."));
        }
        var (filter, problem) = FilterOf(proposal, person, from, to);
        return filter is null
            ? Task.FromResult(problem!)
            : ApiProblems.RunAsync(async () =>
            {
                AuditSearchResult found = await search.SearchAsync(ActorFactory.From(context.User)!, filter, count, cancellationToken).ConfigureAwait(false);
                return Results.Ok(new AuditEventsResponse([.. found.Rows.Select(AuditEventResponse.From)], found.More));
            });
    }

    private static Task<IResult> CsvAsync(HttpContext context, AuditSearch search, string? proposal, string? person, string? from, string? to, CancellationToken cancellationToken)
    {
        var (filter, problem) = FilterOf(proposal, person, from, to);
        return filter is null
            ? Task.FromResult(problem!)
            : ApiProblems.RunAsync(async () =>
            {
                AuditSearchResult found = await search.SearchAsync(ActorFactory.From(context.User)!, filter, AuditSearch.MaxRows, cancellationToken).ConfigureAwait(false);
                return Results.File(AuditCsv.Write(found.Rows), "text/csv; charset=utf-8", AuditCsv.FileName(filter));
            });
    }

    /// <summary>The filter the query asks for, or the problem naming the day that could not be read.</summary>
    public static (AuditFilter? Filter, IResult? Problem) FilterOf(string? proposal, string? person, string? from, string? to)
    {
        DateOnly? first = null, last = null;
        if (!string.IsNullOrWhiteSpace(from))
        {
            if (!DateOnly.TryParseExact(from.Trim(), "yyyy-MM-dd", CultureInfo.InvariantCulture, DateTimeStyles.None, out DateOnly day))
            {
                return (null, ApiProblems.Invalid("from", "Give the first day as yyyy-mm-dd."));
            }
            first = day;
        }
        if (!string.IsNullOrWhiteSpace(to))
        {
            if (!DateOnly.TryParseExact(to.Trim(), "yyyy-MM-dd", CultureInfo.InvariantCulture, DateTimeStyles.None, out DateOnly day))
            {
                return (null, ApiProblems.Invalid("to", "Give the last day as yyyy-mm-dd."));
            }
            last = day;
        }
        return (new AuditFilter(proposal, person, first, last), null);
    }
}
