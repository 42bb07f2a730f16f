using CapReview.Engine.Depreciation;
using CapReview.Engine.Taxes;

namespace CapReview.Engine.Specifications;

/// <summary>How the first cost is depreciated.</summary>
public enum DepreciationMethod
{
    StraightLine,
    DecliningBalance,
    SumOfYearsDigits,
    UnitsOfProduction,
    Macrs,
}

/// <summary>The after-tax settings of a yearly model as entered; every field is optional until it is read.</summary>
public sealed record TaxSpec
{
    /// <summary>The effective income-tax rate, or the federal rate when <see cref="StateTaxRate"/> is given.</summary>
    public double? IncomeTaxRate { get; init; }

    /// <summary>A state rate deductible from federal income: the two are combined as s + f (1 − s).</summary>
    public double? StateTaxRate { get; init; }

    /// <summary>The rate on the part of a gain at disposal above the original basis (recaptured depreciation is ordinary income); null for the income-tax rate.</summary>
    public double? GainTaxRate { get; init; }

    public DepreciationSpec? Depreciation { get; init; }

    public LossTreatment? Losses { get; init; }

    public IReadOnlyList<TaxCreditSpec?>? Credits { get; init; }

    public LoanSpec? Loan { get; init; }

    /// <summary>The MARR after tax; null for the before-tax MARR times (1 − tax rate).</summary>
    public RateSpec? AfterTaxMarr { get; init; }
}

/// <summary>The depreciation of the first cost as entered.</summary>
public sealed record DepreciationSpec
{
    public DepreciationMethod? Method { get; init; }

    /// <summary>The depreciable basis; null for the first cost (the capital outlay at period 0).</summary>
    public double? Basis { get; init; }

    /// <summary>Years, for the book methods.</summary>
    public int? Life { get; init; }

    /// <summary>The salvage the book methods depreciate to; default 0.</summary>
    public double? Salvage { get; init; }

    /// <summary>The declining-balance factor: 2 for 200 %, 1.5 for 150 %.</summary>
    public double? Factor { get; init; }

    public bool? SwitchToStraightLine { get; init; }

    public MacrsClass? PropertyClass { get; init; }

    public MacrsConvention? Convention { get; init; }

    /// <summary>Under MACRS: the quarter (mid-quarter) or month (mid-month) placed in service.</summary>
    public int? PlacedInPeriod { get; init; }

    /// <summary>Under MACRS: the quarter or month of disposal, when the asset is sold before the end of its recovery.</summary>
    public int? DisposalPeriod { get; init; }

    public double? TotalUnits { get; init; }

    public IReadOnlyList<double>? UnitsByYear { get; init; }
}

/// <summary>A tax credit as entered.</summary>
public sealed record TaxCreditSpec
{
    public int? Year { get; init; }

    public double? Amount { get; init; }
}

/// <summary>A loan for part of the first cost as entered.</summary>
public sealed record LoanSpec
{
    public double? Share { get; init; }

    public double? Rate { get; init; }

    public int? Term { get; init; }
}
