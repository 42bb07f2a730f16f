using System.Globalization;
using CapReview.Reviews.Common;
using CapReview.Reviews.Portfolio;
using CapReview.Web.Formatting;
using CapReview.Web.Identity;
using Microsoft.AspNetCore.Authorization;

namespace CapReview.Web.Exports;

/// <summary>
/// Downloads of a cycle's ranking and funded portfolio as CSV or XLSX, for the board, finance and administrators,
/// with the same what-if settings as the pages: <c>shift</c> (MARR points), <c>limit</c> (capital now),
/// <c>objective</c> (presentWorth or annualWorth) and <c>basis</c> (beforeTax or afterTax).
/// </summary>
public static class ExportEndpoints
{
    private const string Roles = "Reviewer,Finance,Administrator";

    public static IEndpointRouteBuilder MapExportEndpoints(this IEndpointRouteBuilder routes)
    {
        var group = routes.MapGroup("/cycles/{id:int}").RequireAuthorization(new AuthorizeAttribute { Roles = Roles }).ExcludeFromDescription();
        group.MapGet("/ranking/{format:regex(^(csv|xlsx)$)}", RankingAsync);
        group.MapGet("/portfolio/{format:regex(^(csv|xlsx)$)}", PortfolioAsync);
        return routes;
    }

    /// <summary>The page's query for the same what-if, e.g. <c>?shift=2&amp;limit=1500000</c>.</summary>
    public static string Query(double shiftPoints, decimal? limit, SelectionObjective? objective, bool afterTax = false)
    {
        var parts = new List<string>();
        if (afterTax)
        {
            parts.Add("basis=afterTax");
        }
        if (shiftPoints != 0)
        {
            parts.Add("shift=" + shiftPoints.ToString(CultureInfo.InvariantCulture));
        }
        if (limit is decimal l)
        {
            parts.Add("limit=" + l.ToString(CultureInfo.InvariantCulture));
        }
        if (objective is SelectionObjective o)
        {
            parts.Add("objective=" + (o == SelectionObjective.AnnualWorth ? "annualWorth" : "presentWorth"));
        }
        return parts.Count == 0 ? "" : "?" + string.Join("&", parts);
    }

    private static async Task<IResult> RankingAsync(int id, string format, HttpContext context, CycleRankingService rankings, DisplayFormat display, CancellationToken cancellationToken)
    {
        if (!TryRead(context.Request.Query, out PortfolioQuery query, out IResult? problem))
        {
            return problem!;
        }
        return await RunAsync(async () =>
        {
            var ranking = await rankings.RankAsync(ActorFactory.From(context.User)!, id, query.MarrShift, cancellationToken, query.AfterTax).ConfigureAwait(false);
            return File(RankingExport.Table(ranking, display.CurrencyCode), format);
        }).ConfigureAwait(false);
    }

    private static async Task<IResult> PortfolioAsync(int id, string format, HttpContext context, PortfolioService portfolio, DisplayFormat display, CancellationToken cancellationToken)
    {
        if (!TryRead(context.Request.Query, out PortfolioQuery query, out IResult? problem))
        {
            return problem!;
        }
        return await RunAsync(async () =>
        {
            var result = await portfolio.SelectAsync(ActorFactory.From(context.User)!, id, query, cancellationToken).ConfigureAwait(false);
            return File(PortfolioExport.Table(result, display.CurrencyCode), format);
        }).ConfigureAwait(false);
    }

    private static async Task<IResult> RunAsync(Func<Task<IResult>> export)
    {
        try
        {
            return await export().ConfigureAwait(false);
        }
        catch (NotFoundException ex)
        {
            return Results.Problem(ex.Message, statusCode: StatusCodes.Status404NotFound);
        }
        catch (RuleViolationException ex)
        {
            return Invalid("query", ex.Message);
        }
    }

    private static IResult File(ExportTable table, string format) => format == "csv"
        ? Results.File(CsvExport.Write(table), "text/csv; charset=utf-8", table.FileStem + ".csv")
        : Results.File(XlsxExport.Write(table), "application/vnd.openxmlformats-officedocument.spreadsheetml.sheet", table.FileStem + ".xlsx");

    private static bool TryRead(IQueryCollection q, out PortfolioQuery query, out IResult? problem)
    {
        query = new PortfolioQuery();
        problem = null;
        if (q.TryGetValue("shift", out var shiftText))
        {
            if (!double.TryParse(shiftText, NumberStyles.Float, CultureInfo.InvariantCulture, out double points) || !double.IsFinite(points) || Math.Abs(points) > 10)
            {
                problem = Invalid("shift", "Give the MARR shift in percentage points, between −10 and 10.");
                return false;
            }
            query = query with { MarrShift = points / 100 };
        }
        if (q.TryGetValue("limit", out var limitText))
        {
            if (!decimal.TryParse(limitText, NumberStyles.Number, CultureInfo.InvariantCulture, out decimal limit) || limit < 0)
            {
                problem = Invalid("limit", "Give the capital limit as a number, zero or more.");
                return false;
            }
            query = query with { CapitalLimit = limit };
        }
        if (q.TryGetValue("basis", out var basisText))
        {
            if (basisText.ToString() is not ("afterTax" or "beforeTax"))
            {
                problem = Invalid("basis", "Choose beforeTax or afterTax.");
                return false;
            }
            query = query with { AfterTax = basisText.ToString() == "afterTax" };
        }
        if (q.TryGetValue("objective", out var objectiveText))
        {
            SelectionObjective? objective = objectiveText.ToString() switch
            {
                "presentWorth" => SelectionObjective.PresentWorth,
                "annualWorth" => SelectionObjective.AnnualWorth,
                _ => null,
            };
            if (objective is null)
            {
                problem = Invalid("objective", "Choose presentWorth or annualWorth.");
                return false;
            }
            query = query with { Objective = objective };
        }
        return true;
    }

    private static IResult Invalid(string field, string message) =>
        Results.ValidationProblem(new Dictionary<string, string[]> { [field] = [message] }, title: "The export could not be made.");
}
