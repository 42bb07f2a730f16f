namespace CapReview.Reviews.Common;

/// <summary>A request the domain refuses, with a message fit to show the user. The web layer turns each kind into a status.</summary>
public abstract class ReviewException(string message) : Exception(message);

/// <summary>The actor's roles do not allow this.</summary>
public sealed class AccessDeniedException(string message) : ReviewException(message);

/// <summary>There is no such item, or none the actor may see.</summary>
public sealed class NotFoundException(string message) : ReviewException(message);

/// <summary>Someone else changed the item since it was read; nothing was saved.</summary>
public sealed class ConcurrencyConflictException(string message) : ReviewException(message);

/// <summary>A business rule forbids this: a transition not allowed from the current status, a frozen version, invalid input.</summary>
/// <remarks>
/// A message may start with the field it concerns as a path ("capitalLimit: …"): the path is kept in <see cref="Field"/>
/// for the API's machine answer and put in words in the message, which is what every reader sees.
/// </remarks>
public sealed class RuleViolationException(string message) : ReviewException(Display.FieldWording.InWords(message))
{
    /// <summary>The field path the refusal concerns, or null when it concerns the request as a whole.</summary>
    public string? Field { get; } = Display.FieldWording.FieldOf(message);
}
