using CapReview.Reviews.Interchange;
using CapReview.Web.Identity;

namespace CapReview.Web.Api;

/// <summary>
/// A whole cycle as a JSON document (format capreview.cycle, docs/cycle-format.md): GET to export it (board and
/// administrators), bare or signed by this installation's certificate; POST to import one as a new cycle
/// (administrators), a signed one only from a trusted signer. A refused import names every problem by
/// its path in the document and writes nothing.
/// </summary>
public static class CycleDocumentEndpoints
{
    public static IEndpointRouteBuilder MapCycleDocumentEndpoints(this IEndpointRouteBuilder routes)
    {
        routes.MapGet("/api/v1/cycles/{id:int}/document", ExportAsync)
            .WithName("ExportCycle")
            .WithSummary("The whole cycle as a capreview.cycle document, to archive or to import elsewhere")
            .Produces<CycleDocument>()
            .ProducesProblem(StatusCodes.Status403Forbidden)
            .ProducesProblem(StatusCodes.Status404NotFound)
            .RequireAuthorization(IdentityRegistration.Api);
        routes.MapGet("/api/v1/cycles/{id:int}/document/signed", ExportSignedAsync)
            .WithName("ExportSignedCycle")
            .WithSummary("The cycle document and its detached signature by this installation's certificate, as a ZIP that another installation verifies on import")
            .Produces(StatusCodes.Status200OK, contentType: "application/zip")
            .ProducesProblem(StatusCodes.Status403Forbidden)
            .ProducesProblem(StatusCodes.Status404NotFound)
            .RequireAuthorization(IdentityRegistration.Api);
        routes.MapPost("/api/v1/cycles/import", ImportAsync)
            .WithName("ImportCycle")
            .WithSummary("Import a capreview.cycle document as a new cycle (administrators)")
            .Accepts<CycleDocument>("application/json", "application/zip")
            .Produces<CycleImportResult>(StatusCodes.Status201Created)
            .ProducesValidationProblem()
            .ProducesProblem(StatusCodes.Status403Forbidden)
            .RequireAuthorization(IdentityRegistration.Api)
            .DisableAntiforgery();
        return routes;
    }

    private static Task<IResult> ExportAsync(int id, HttpContext context, CycleExporter exporter, CancellationToken cancellationToken) =>
        ApiProblems.RunAsync(async () =>
        {
            CycleDocument document = await exporter.ExportAsync(ActorFactory.From(context.User)!, id, cancellationToken).ConfigureAwait(false);
            return Results.File(CycleDocumentJson.Write(document), "application/json", FileName(document.Cycle!.Name!));
        });

    private static Task<IResult> ExportSignedAsync(int id, HttpContext context, CycleExporter exporter, CapReview.Packets.Signing.CycleDocumentSigning signing,
        CancellationToken cancellationToken) =>
        ApiProblems.RunAsync(async () =>
        {
            CycleDocument document = await exporter.ExportAsync(ActorFactory.From(context.User)!, id, cancellationToken).ConfigureAwait(false);
            byte[] bytes = CycleDocumentJson.Write(document);
            byte[] signature = await signing.SignAsync(bytes, cancellationToken).ConfigureAwait(false);
            string name = FileName(document.Cycle!.Name!);
            return Results.File(SignedCycleDocument.Pack(name, bytes, signature), "application/zip", Path.ChangeExtension(name, ".signed.zip"));
        });

    private static async Task<IResult> ImportAsync(HttpRequest request, CycleImporter importer, CancellationToken cancellationToken)
    {
        if (request.ContentLength > CycleDocumentJson.MaxBytes)
        {
            return ApiProblems.Invalid("document", $"The document is larger than {CycleDocumentJson.MaxBytes / 1024 / 1024} MiB.");
        }
        // Read no more than the limit allows, whether or not the request said its length.
        using var buffer = new MemoryStream();
        byte[] chunk = new byte[81_920];
        int read;
        while ((read = await request.Body.ReadAsync(chunk, cancellationToken).ConfigureAwait(false)) > 0)
        {
            if (buffer.Length + read > CycleDocumentJson.MaxBytes)
            {
                return ApiProblems.Invalid("document", $"The document is larger than {CycleDocumentJson.MaxBytes / 1024 / 1024} MiB.");
            }
            buffer.Write(chunk, 0, read);
        }
        return await ApiProblems.RunAsync(async () =>
        {
            try
            {
                var result = await importer.ImportAsync(ActorFactory.From(request.HttpContext.User)!, buffer.ToArray(), cancellationToken).ConfigureAwait(false);
                return Results.Created($"/api/v1/cycles/{result.CycleId}", result);
            }
            catch (ImportRefusedException ex)
            {
                return ApiProblems.Invalid(ex.Problems, "The cycle was not imported; nothing was changed.");
            }
        }).ConfigureAwait(false);
    }

    /// <summary>"Capital cycle 2027" → "cycle-capital-cycle-2027.json".</summary>
    public static string FileName(string cycleName) =>
        "cycle-" + string.Concat(cycleName.Select(c => char.IsLetterOrDigit(c) ? char.ToLowerInvariant(c) : '-')).Trim('-') + ".json";
}
