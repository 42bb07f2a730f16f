using CapReview.Reviews.Common;
using CapReview.Reviews.Records;
using CapReview.Web.Identity;

namespace CapReview.Web.Packets;

/// <summary>GET /packets/{id}: a stored, signed packet, byte for byte as it was made; every download is audited.</summary>
public static class PacketEndpoints
{
    public static IEndpointRouteBuilder MapPacketEndpoints(this IEndpointRouteBuilder routes)
    {
        routes.MapGet("/packets/{id:int}", DownloadAsync).RequireAuthorization(IdentityRegistration.SignedIn).ExcludeFromDescription();
        return routes;
    }

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
            return Results.Problem(ex.Message, statusCode: StatusCodes.Status409Conflict);
        }
    }
}
