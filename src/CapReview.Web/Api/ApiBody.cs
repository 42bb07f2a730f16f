using System.Text.Json;

namespace CapReview.Web.Api;

/// <summary>
/// Reads a JSON request body the same way for every endpoint that takes one: a size limit, JSON only, and a problem
/// naming the field a value could not be read into.
/// </summary>
public static class ApiBody
{
    /// <summary>The body as <typeparamref name="T"/>, or the problem to answer with (and a null body).</summary>
    public static async Task<(T? Body, IResult? Problem)> ReadAsync<T>(HttpRequest request, string what, CancellationToken cancellationToken)
        where T : class
    {
        ArgumentNullException.ThrowIfNull(request);
        if (request.ContentLength > EvaluationEndpoints.MaxRequestBytes)
        {
            return (null, ApiProblems.Invalid("body", $"The request is larger than {EvaluationEndpoints.MaxRequestBytes:N0} bytes."));
        }
        if (!request.HasJsonContentType())
        {
            return (null, ApiProblems.Invalid("body", $"Send {what} as application/json."));
        }
        // A body sent without its length (chunked) is cut off at the limit too, not read whole.
        byte[]? bytes = await JsonBody.ReadAsync(request, EvaluationEndpoints.MaxRequestBytes, cancellationToken).ConfigureAwait(false);
        if (bytes is null)
        {
            return (null, ApiProblems.Invalid("body", $"The request is larger than {EvaluationEndpoints.MaxRequestBytes:N0} bytes."));
        }
        try
        {
            T? body = JsonSerializer.Deserialize<T>(bytes, ApiJson.Options);
            return body is null ? (null, ApiProblems.Invalid("body", $"Send {what} as a JSON object.")) : (body, null);
        }
        catch (JsonException ex)
        {
            return (null, ApiProblems.Invalid(EvaluationEndpoints.FieldOf(ex.Path), FiniteNumberConverter.Refusal(ex)));
        }
    }
}
