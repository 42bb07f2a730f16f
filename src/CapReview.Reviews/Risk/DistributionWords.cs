using CapReview.Engine.Risk;

namespace CapReview.Reviews.Risk;

/// <summary>A distribution's name as people write it, on pages and in packets: "PERT" is an acronym, not "Pert".</summary>
public static class DistributionWords
{
    public static string Name(DistributionKind kind) => kind switch
    {
        DistributionKind.Uniform => "Uniform",
        DistributionKind.Triangular => "Triangular",
        DistributionKind.Pert => "PERT",
        DistributionKind.Normal => "Normal",
        DistributionKind.Lognormal => "Lognormal",
        DistributionKind.Discrete => "Discrete",
        _ => kind.ToString(),
    };
}
