using System.Diagnostics.CodeAnalysis;

namespace CapReview.Engine.Specifications;

/// <summary>The shapes a cash-flow element can take.</summary>
public enum ElementKind
{
    /// <summary>One amount at one period.</summary>
    [SuppressMessage("Naming", "CA1720:Identifier contains type name", Justification = "The trade's word for a one-off amount, and the API's.")]
    Single,

    /// <summary>The same amount every period over a span.</summary>
    Uniform,

    /// <summary>An amount changing by a fixed step each period.</summary>
    Arithmetic,

    /// <summary>An amount growing by a fixed percentage each period.</summary>
    Geometric,

    /// <summary>An amount every k periods over a span.</summary>
    Recurring,
}
