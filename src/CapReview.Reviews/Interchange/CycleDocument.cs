using CapReview.Engine.Rates;
using CapReview.Reviews.Cycles;
using CapReview.Reviews.Decisions;
using CapReview.Reviews.Portfolio;
using CapReview.Reviews.Proposals;

namespace CapReview.Reviews.Interchange;

/// <summary>
/// A whole budget cycle as one JSON document, to move it to another installation or to archive it outside the
/// database: format <c>capreview.cycle</c>, version 1 (docs/cycle-format.md). People are named by name and e-mail,
/// never by an installation's user ids; proposals by reference; each version's assumptions with their SHA-256, which
/// an import checks.
/// </summary>
public sealed record CycleDocument
{
    public const string FormatName = "capreview.cycle";
    public const int CurrentVersion = 1;

    public string? Format { get; init; }

    public int? FormatVersion { get; init; }

    public DateTimeOffset? ExportedAt { get; init; }

    /// <summary>The exporting installation, as it names itself (its organisation's name); optional.</summary>
    public string? Installation { get; init; }

    public string? Cautions { get; init; }

    public PolicyEntry? MarrPolicy { get; init; }

    public CycleEntry? Cycle { get; init; }

    public IReadOnlyList<ProposalEntry>? Proposals { get; init; }

    public IReadOnlyList<GroupEntry>? ExclusiveGroups { get; init; }

    public IReadOnlyList<ContingencyEntry>? Contingencies { get; init; }

    public IReadOnlyList<DecisionEntry>? Decisions { get; init; }

    public IReadOnlyList<SignOffEntry>? SignOffs { get; init; }
}

/// <summary>Someone named in a document: their name, and their e-mail where the exporting installation knows it.</summary>
public sealed record PersonEntry(string? Name, string? Email);

/// <summary>The MARR policy version the cycle is evaluated under, and its number and SHA-256 where it was exported from.</summary>
public sealed record PolicyEntry
{
    public double? Rate { get; init; }
    public RateBasis? Basis { get; init; }
    public int? CompoundingsPerYear { get; init; }
    public DateOnly? EffectiveFrom { get; init; }
    public double? LowRiskPremium { get; init; }
    public double? StandardRiskPremium { get; init; }
    public double? HighRiskPremium { get; init; }
    public double? InflationRate { get; init; }
    public bool? RealMarr { get; init; }
    public double? AfterTaxRate { get; init; }
    public string? Reason { get; init; }
    public PersonEntry? SetBy { get; init; }
    public int? SourceNumber { get; init; }
    public string? SourceSha256 { get; init; }
}

public sealed record CycleEntry
{
    public string? Name { get; init; }
    public CycleStatus? Status { get; init; }
    public decimal? CapitalLimit { get; init; }
    public IReadOnlyList<decimal>? LaterYearLimits { get; init; }
    public int? StudyPeriodYears { get; init; }
    public SelectionObjective? Objective { get; init; }
    public DateOnly? OpensOn { get; init; }
    public DateOnly? ClosesOn { get; init; }
    public int? RequiredSignOffs { get; init; }
}

public sealed record ProposalEntry
{
    public string? Reference { get; init; }
    public string? Title { get; init; }
    public string? Description { get; init; }
    public ProposalCategory? Category { get; init; }
    public RiskClass? RiskClass { get; init; }
    public ProposalStatus? Status { get; init; }
    public PersonEntry? Lead { get; init; }
    public IReadOnlyList<VersionEntry>? Versions { get; init; }
}

public sealed record VersionEntry
{
    public int? Number { get; init; }
    public PersonEntry? Author { get; init; }
    public DateTimeOffset? CreatedAt { get; init; }
    public string? Reason { get; init; }
    public bool? Frozen { get; init; }
    public DateTimeOffset? FrozenAt { get; init; }
    public string? AssumptionsSha256 { get; init; }
    public ProposalAssumptions? Assumptions { get; init; }
}

public sealed record GroupEntry(string? Name, bool? Mandatory, IReadOnlyList<string>? Members);

public sealed record ContingencyEntry(string? Dependent, string? Prerequisite);

public sealed record DecisionEntry
{
    public string? Proposal { get; init; }
    public int? Version { get; init; }
    public string? AssumptionsSha256 { get; init; }
    public DecisionOutcome? Outcome { get; init; }
    public string? Conditions { get; init; }
    public PersonEntry? DecidedBy { get; init; }
    public DateTimeOffset? DecidedAt { get; init; }

    /// <summary>The board's rules the decision was recorded against, in words; left out when it broke none.</summary>
    public string? OverriddenRules { get; init; }

    /// <summary>Why it was recorded all the same; given exactly when <see cref="OverriddenRules"/> is.</summary>
    public string? OverrideReason { get; init; }
}

public sealed record SignOffEntry
{
    public PersonEntry? By { get; init; }
    public DateTimeOffset? SignedAt { get; init; }
    public string? DecisionsSigned { get; init; }
}
