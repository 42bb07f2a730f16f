using CapReview.Engine.Validation;
using CapReview.Reviews.Common;
using CapReview.Reviews.Display;

namespace CapReview.Web.Api;

/// <summary>The API's answers when a request cannot be served: problem details, with the field named where there is one.</summary>
public static class ApiProblems
{
    public static IResult Invalid(string field, string message, string title = "The request could not be served.") => Invalid([new InputError(field, message)], title);

    /// <summary>
    /// A 400 whose <c>errors</c> keep each field's path for programs and whose <c>detail</c> says the same in words
    /// for people ("Element 1, last period: The last period is after the horizon (6).").
    /// </summary>
    public static IResult Invalid(IReadOnlyList<InputError> errors, string title)
    {
        ArgumentNullException.ThrowIfNull(errors);
        return Results.ValidationProblem(
            errors.GroupBy(e => e.Field).ToDictionary(g => g.Key, g => g.Select(e => e.Message).ToArray()),
            detail: string.Join(" ", errors.Select(InWords)),
            title: title);
    }

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
            return Invalid(ex.Field ?? "body", ex.Message);
        }
        catch (Reviews.Runs.RunLimitReachedException ex)
        {
            return new TooManyRunsResult(ex.Message);
        }
    }

    private static string InWords(InputError error)
    {
        string message = FieldWording.InWords(error.Message);
        return error.Field == "body" || message.StartsWith(FieldWording.Describe(error.Field) + ":", StringComparison.Ordinal)
            ? message : $"{FieldWording.Describe(error.Field)}: {message}";
    }
}
