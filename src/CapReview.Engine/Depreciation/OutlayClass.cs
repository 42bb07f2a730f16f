namespace CapReview.Engine.Depreciation;

/// <summary>
/// A later capital outlay's own depreciation, when it is not the first cost's: under MACRS a property class, under
/// the book methods (straight line, declining balance, sum of the years' digits) a life in years. The first cost's
/// method, convention and factor still apply; only the class or the life is the outlay's own.
/// </summary>
public sealed record OutlayClass
{
    /// <summary>Under MACRS: the outlay's property class.</summary>
    public MacrsClass? PropertyClass { get; init; }

    /// <summary>Under the book methods: the outlay's life in years, 1 to 100.</summary>
    public int? Life { get; init; }

    /// <summary>Whether neither is given: the outlay then takes the first cost's class or life. A method, not a property, so that it is never stored.</summary>
    public bool IsEmpty() => PropertyClass is null && Life is null;
}
