using CapReview.Engine.CashFlows;
using CapReview.Engine.Inflation;
using CapReview.Engine.Measures;
using CapReview.Engine.Risk;
using CapReview.Engine.Specifications;
using CapReview.Reviews.Proposals;

namespace CapReview.Reviews.Display;

/// <summary>
/// The words a person reads for each stored choice (a category, an element's shape, a distribution): pages, packets,
/// exports and the API's messages take them from here, so no enum name reaches a reader.
/// </summary>
public static class EnumWording
{
    public static string Of(ProposalCategory category) => category switch
    {
        ProposalCategory.Replacement => "Replacement",
        ProposalCategory.Expansion => "Expansion",
        ProposalCategory.CostReduction => "Cost reduction",
        ProposalCategory.Compliance => "Compliance",
        _ => "Other",
    };

    public static string Of(RiskClass risk) => risk switch
    {
        RiskClass.Low => "Low",
        RiskClass.High => "High",
        _ => "Standard",
    };

    public static string Of(CashFlowCategory category) => category switch
    {
        CashFlowCategory.Capital => "Capital",
        CashFlowCategory.Operating => "Operating",
        CashFlowCategory.Revenue => "Revenue",
        CashFlowCategory.Salvage => "Salvage",
        _ => "Tax",
    };

    public static string Of(ElementKind kind) => kind switch
    {
        ElementKind.Single => "Single amount",
        ElementKind.Uniform => "Uniform series",
        ElementKind.Arithmetic => "Arithmetic gradient",
        ElementKind.Geometric => "Geometric gradient",
        _ => "Recurring amount",
    };

    public static string Of(DistributionKind kind) => kind switch
    {
        DistributionKind.Uniform => "Uniform",
        DistributionKind.Triangular => "Triangular",
        DistributionKind.Pert => "PERT",
        DistributionKind.Normal => "Normal",
        DistributionKind.Lognormal => "Lognormal",
        _ => "Discrete",
    };

    public static string Of(ProposalStatus status) => status switch
    {
        ProposalStatus.Draft => "Draft",
        ProposalStatus.Submitted => "Submitted",
        ProposalStatus.InReview => "In review",
        ProposalStatus.Approved => "Approved",
        ProposalStatus.ReturnedForChanges => "Returned for changes",
        ProposalStatus.Rejected => "Rejected",
        _ => "Withdrawn",
    };

    /// <summary>A rate of return the figures cannot give as one number, in words: "none" or "several rates".</summary>
    public static string Of(RateOfReturnKind kind) => kind switch
    {
        RateOfReturnKind.None => "none",
        RateOfReturnKind.Several => "several rates",
        _ => "one rate",
    };

    public static string Of(MoneyBasis money) => money == MoneyBasis.Constant ? "Constant money" : "Actual money";

    /// <summary>A stored choice (as the canonical JSON writes it, e.g. "costReduction") of the field <paramref name="leaf"/>, in words; null when it is none.</summary>
    public static string? FromStored(string leaf, string value)
    {
        ArgumentNullException.ThrowIfNull(leaf);
        ArgumentNullException.ThrowIfNull(value);
        return leaf switch
        {
            "type" => Parse<ElementKind>(value) is { } kind ? Of(kind) : null,
            "category" => Parse<CashFlowCategory>(value) is { } category ? Of(category) : null,
            "distribution" => Parse<DistributionKind>(value) is { } distribution ? Of(distribution) : null,
            "money" => Parse<MoneyBasis>(value) is { } money ? Of(money) : null,
            _ => null,
        };
    }

    private static T? Parse<T>(string value) where T : struct, Enum =>
        Enum.TryParse(value, ignoreCase: true, out T parsed) && value.Length > 0 && !char.IsDigit(value[0]) ? parsed : null;
}
