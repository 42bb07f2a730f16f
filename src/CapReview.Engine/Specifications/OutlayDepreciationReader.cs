using CapReview.Engine.Depreciation;
using CapReview.Engine.Taxes;

namespace CapReview.Engine.Specifications;

/// <summary>
/// The first cost's depreciation applied to a later capital outlay: the same method, life, factor or MACRS class and
/// convention (with the first cost's quarter or month), to no salvage, since the salvage entered belongs to the first
/// cost. Under units of production an outlay is spread over the units still to come from its year.
/// </summary>
internal static class OutlayDepreciationReader
{
    /// <summary>The rule for a depreciation that <see cref="TaxSpecReader"/> has already read without error.</summary>
    public static OutlayDepreciation Read(DepreciationSpec spec, double disposalYearShare) =>
        new(spec.Method switch
        {
            DepreciationMethod.Macrs => (cost, _) => Macrs.Schedule(cost, spec.PropertyClass!.Value, Convention(spec), spec.PlacedInPeriod ?? 1),
            DepreciationMethod.UnitsOfProduction => (cost, year) => RemainingUnits(cost, year, spec.TotalUnits!.Value, spec.UnitsByYear!),
            DepreciationMethod.StraightLine => (cost, _) => BookDepreciation.StraightLine(cost, 0, spec.Life!.Value),
            DepreciationMethod.SumOfYearsDigits => (cost, _) => BookDepreciation.SumOfYearsDigits(cost, 0, spec.Life!.Value),
            _ => (cost, _) => BookDepreciation.DecliningBalance(cost, 0, spec.Life!.Value, spec.Factor ?? 2.0, spec.SwitchToStraightLine ?? true),
        }, disposalYearShare);

    private static MacrsConvention Convention(DepreciationSpec spec) =>
        spec.Convention ?? (spec.PropertyClass is MacrsClass.ResidentialRental or MacrsClass.Nonresidential ? MacrsConvention.MidMonth : MacrsConvention.HalfYear);

    private static DepreciationSchedule RemainingUnits(double cost, int year, double totalUnits, IReadOnlyList<double> unitsByYear)
    {
        var later = unitsByYear.Skip(year - 1).ToList();
        // At least the later units themselves, so that rounding in the subtraction never leaves them more than the total.
        double remaining = Math.Max(totalUnits - unitsByYear.Take(year - 1).Sum(), later.Sum());
        // No production left to spread it over: the outlay keeps its cost as book value until disposal.
        return remaining > 0 && later.Count > 0
            ? BookDepreciation.UnitsOfProduction(cost, 0, remaining, later)
            : new DepreciationSchedule(cost, [], "units of production, no units left");
    }
}
