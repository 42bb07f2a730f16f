namespace CapReview.Engine.Validation;

/// <summary>Either a value or the list of input errors that prevented it; never both, never an exception for bad input.</summary>
public sealed class Outcome<T>
    where T : class
{
    internal Outcome(T? value, IReadOnlyList<InputError> errors)
    {
        Value = value;
        Errors = errors;
    }

    public T? Value { get; }

    public IReadOnlyList<InputError> Errors { get; }

    public bool IsValid => Value is not null;
}

/// <summary>Builds outcomes.</summary>
public static class Outcome
{
    public static Outcome<T> Success<T>(T value)
        where T : class
    {
        ArgumentNullException.ThrowIfNull(value);
        return new(value, []);
    }

    public static Outcome<T> Failure<T>(IReadOnlyList<InputError> errors)
        where T : class
    {
        ArgumentNullException.ThrowIfNull(errors);
        if (errors.Count == 0)
        {
            throw new ArgumentException("A failure needs at least one error.", nameof(errors));
        }
        return new(null, errors);
    }
}
