using CapReview.Reviews.Common;

namespace CapReview.Web.Api;

/// <summary>The API's answers when a request cannot be served: problem details, with the field named where there is one.</summary>
public static class ApiProblems
{
    public static IResult Invalid(string field, string message) =>
        Results.ValidationProblem(new Dictionary<string, string[]> { [field] = [message] }, title: "The request could not be served.");

    /// <summary>Runs <paramref name="action"/>, turning the domain's refusals into 400, 403, 404, 409 and (a run limit) 429.</summary>
    public static async Task<IResult> RunAsync(Func<Task<IResult>> action)
    {
        ArgumentNullException.ThrowIfNull(action);
        try
        {
            return await action().ConfigureAwait(false);
        }
        catch (AccessDeniedException ex)
        {
            return Results.Problem(ex.Message, statusCode: StatusCodes.Status403Forbidden);
        }
        catch (NotFoundException ex)
        {
            return Results.Problem(ex.Message, statusCode: StatusCodes.Status404NotFound);
        }
        catch (ConcurrencyConflictException ex)
        {
            return Results.Problem(ex.Message, statusCode: StatusCodes.Status409Conflict);
        }
        catch (RuleViolationException ex)
        {
            return Invalid(FieldOf(ex.Message), ex.Message);
        }
        catch (Reviews.Runs.RunLimitReachedException ex)
        {
            return new TooManyRunsResult(ex.Message);
        }
    }

    /// <summary>The field a domain message names ("title: …" or "elements[2].amount: …"), else "body".</summary>
    private static string FieldOf(string message)
    {
        int colon = message.IndexOf(": ", StringComparison.Ordinal);
        return colon > 0 && !message[..colon].Contains(' ', StringComparison.Ordinal) ? message[..colon] : "body";
    }
}
