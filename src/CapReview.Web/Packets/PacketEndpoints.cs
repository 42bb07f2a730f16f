using CapReview.Reviews.Common;
using CapReview.Reviews.Records;
using CapReview.Web.Identity;
using CapReview.Web.Operations;

namespace CapReview.Web.Packets;

/// <summary>
/// A stored, signed packet, byte for byte as it was made, at /packets/{id} for the pages and /api/v1/packets/{id}
/// for API tokens, and a cycle's packets as a list; every download is audited.
/// </summary>
public static class PacketEndpoints
{
    public static IEndpointRouteBuilder MapPacketEndpoints(this IEndpointRouteBuilder routes)
    {
        routes.MapGet("/packets/{id:int}", DownloadAsync).RequireAuthorization(IdentityRegistration.SignedIn).ExcludeFromDescription().ShowsThePageWhenMissing();
        routes.MapGet("/api/v1/packets/{id:int}", DownloadAsync)
            .WithName("DownloadPacket")
            .WithSummary("A signed approval packet (PDF), unchanged since it was made")
            .Produces(StatusCodes.Status200OK, contentType: "application/pdf")
            .ProducesProblem(StatusCodes.Status404NotFound)
            .ProducesProblem(StatusCodes.Status409Conflict)
            .RequireAuthorization(IdentityRegistration.Api);
        routes.MapGet("/api/v1/cycles/{id:int}/packets", ListAsync)
            .WithName("ListCyclePackets")
            .WithSummary("The packets of a decided cycle the caller may download, with their SHA-256")
            .Produces<IReadOnlyList<Api.PacketResponse>>()
            .RequireAuthorization(IdentityRegistration.Api);
        return routes;
    }

    private static async Task<IResult> ListAsync(int id, HttpContext context, PacketArchive archive, CancellationToken cancellationToken) =>
        Results.Ok((await archive.ListAsync(ActorFactory.From(context.User)!, id, cancellationToken).ConfigureAwait(false)).Select(Api.PacketResponse.From).ToList());

    private static async Task<IResult> DownloadAsync(int id, HttpContext context, PacketArchive archive, CancellationToken cancellationToken)
    {
        try
        {
            ApprovalPacket packet = await archive.DownloadAsync(ActorFactory.From(context.User)!, id, cancellationToken).ConfigureAwait(false);
            context.Response.Headers.CacheControl = "private, no-store";
            return Results.File(packet.Content, "application/pdf", packet.FileName);
        }
        catch (NotFoundException ex)
        {
            return Results.Problem(ex.Message, statusCode: StatusCodes.Status404NotFound);
        }
        catch (RuleViolationException ex)
        {
            // A stored packet that no longer matches its hash: a conflict with the record, not bad input.
            return Results.Problem(ex.Message, statusCode: StatusCodes.Status409Conflict);
        }
    }
}
