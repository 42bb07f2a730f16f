using CapReview.Reviews.Common;
using CapReview.Reviews.Cycles;
using CapReview.Reviews.Marr;
using CapReview.Reviews.Proposals;
using CapReview.Reviews.Portfolio;
using CapReview.Web.Api;
using CapReview.Web.Formatting;
using CapReview.Web.Identity;
using CapReview.Web.Operations;

namespace CapReview.Web.Exports;

/// <summary>
/// Downloads of a proposal version (one workbook, or one CSV per table), and of a cycle's ranking and funded
/// portfolio as CSV or XLSX, for the board, finance and administrators (a browser's cookie or an API token), with the same what-if settings as the pages: <c>shift</c> (MARR points), <c>limit</c> (capital now),
/// <c>objective</c> (presentWorth or annualWorth) and <c>basis</c> (beforeTax or afterTax). A CSV is a plain table;
/// its notes and cautions are a table of their own: <c>?table=notes</c> on a cycle's CSV, the table <c>notes</c> of a
/// version (decision 010), and the last sheet of every workbook.
/// </summary>
public static class ExportEndpoints
{
    public static IEndpointRouteBuilder MapExportEndpoints(this IEndpointRouteBuilder routes)
    {
        // The board, finance and administrators, in a browser or with an API token.
        var group = routes.MapGroup("/cycles/{id:int}").RequireAuthorization(IdentityRegistration.BoardDownloads).ExcludeFromDescription().ShowsThePageWhenMissing();
        group.MapGet("/ranking/{format:regex(^(csv|xlsx)$)}", RankingAsync);
        group.MapGet("/portfolio/{format:regex(^(csv|xlsx)$)}", PortfolioAsync);
        // A version is for whoever may read the proposal (its lead, the board, finance once decided, administrators), in a browser or with an API token.
        var version = routes.MapGroup("/proposals/{id:int}/versions/{number:int}").RequireAuthorization(IdentityRegistration.Api).ExcludeFromDescription().ShowsThePageWhenMissing();
        version.MapGet("/xlsx", VersionWorkbookAsync);
        version.MapGet("/csv/{table}", VersionTableAsync);
        return routes;
    }

    private static async Task<IResult> RankingAsync(int id, string format, HttpContext context, CycleRankingService rankings, DisplayFormat display, CancellationToken cancellationToken)
    {
        if (!WhatIfQuery.TryRead(context.Request.Query, out PortfolioQuery query, out IResult? problem))
        {
            return problem!;
        }
        return await ApiProblems.RunAsync(async () =>
        {
            var ranking = await rankings.RankAsync(ActorFactory.From(context.User)!, id, query.MarrShift, cancellationToken, query.AfterTax).ConfigureAwait(false);
            return File(RankingExport.Table(ranking, display.CurrencyCode), format, NotesAsked(context));
        }).ConfigureAwait(false);
    }

    private static async Task<IResult> PortfolioAsync(int id, string format, HttpContext context, PortfolioService portfolio, DisplayFormat display, CancellationToken cancellationToken)
    {
        if (!WhatIfQuery.TryRead(context.Request.Query, out PortfolioQuery query, out IResult? problem))
        {
            return problem!;
        }
        return await ApiProblems.RunAsync(async () =>
        {
            var result = await portfolio.SelectAsync(ActorFactory.From(context.User)!, id, query, cancellationToken).ConfigureAwait(false);
            return File(PortfolioExport.Table(result, display.CurrencyCode), format, NotesAsked(context));
        }).ConfigureAwait(false);
    }

    private static Task<IResult> VersionWorkbookAsync(int id, int number, HttpContext context, ProposalService proposals, CycleService cycles, MarrPolicyService policies, DisplayFormat display, CancellationToken cancellationToken) =>
        ApiProblems.RunAsync(async () =>
        {
            var (proposal, tables) = await VersionTablesAsync(id, number, context, proposals, cycles, policies, display, cancellationToken).ConfigureAwait(false);
            return Results.File(XlsxExport.Write([.. tables.Select(t => t.Table)]), "application/vnd.openxmlformats-officedocument.spreadsheetml.sheet",
                $"{proposal.Reference.ToLowerInvariant()}-v{number}.xlsx");
        });

    private static Task<IResult> VersionTableAsync(int id, int number, string table, HttpContext context, ProposalService proposals, CycleService cycles, MarrPolicyService policies, DisplayFormat display, CancellationToken cancellationToken) =>
        ApiProblems.RunAsync(async () =>
        {
            var (proposal, tables) = await VersionTablesAsync(id, number, context, proposals, cycles, policies, display, cancellationToken).ConfigureAwait(false);
            if (table == "notes")
            {
                return Results.File(CsvExport.WriteNotes([.. tables.Select(t => t.Table)]), "text/csv; charset=utf-8", $"{proposal.Reference.ToLowerInvariant()}-v{number}-notes.csv");
            }
            var found = tables.FirstOrDefault(t => t.Name == table).Table;
            return found is null
                ? Results.Problem($"Version {number} has no table “{table}”; it has {string.Join(", ", tables.Select(t => t.Name))}.", statusCode: StatusCodes.Status404NotFound)
                : Results.File(CsvExport.Write(found), "text/csv; charset=utf-8", $"{proposal.Reference.ToLowerInvariant()}-v{number}-{table}.csv");
        });

    /// <summary>The version's tables under the policy of the cycle it is in, or the current policy for a draft outside any cycle.</summary>
    private static async Task<(ProposalView Proposal, IReadOnlyList<(string Name, ExportTable Table)> Tables)> VersionTablesAsync(
        int id, int number, HttpContext context, ProposalService proposals, CycleService cycles, MarrPolicyService policies, DisplayFormat display, CancellationToken cancellationToken)
    {
        ProposalView proposal = await proposals.GetAsync(ActorFactory.From(context.User)!, id, cancellationToken).ConfigureAwait(false);
        VersionView version = proposal.Version(number);
        MarrPolicyVersion policy = await BoardPolicy.ForAsync(proposal, cycles, policies, cancellationToken).ConfigureAwait(false);
        return (proposal, VersionExport.Tables(proposal, version, policy, display.CurrencyCode));
    }

    private static bool NotesAsked(HttpContext context) => context.Request.Query["table"] == "notes";

    private static IResult File(ExportTable table, string format, bool notes) => (format, notes) switch
    {
        ("csv", true) => Results.File(CsvExport.WriteNotes(table), "text/csv; charset=utf-8", table.FileStem + "-notes.csv"),
        ("csv", false) => Results.File(CsvExport.Write(table), "text/csv; charset=utf-8", table.FileStem + ".csv"),
        _ => Results.File(XlsxExport.Write(table), "application/vnd.openxmlformats-officedocument.spreadsheetml.sheet", table.FileStem + ".xlsx"),
    };

}
