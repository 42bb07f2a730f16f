using CapReview.Engine.Depreciation;
using CapReview.Engine.Taxes;

namespace CapReview.Engine.Specifications;

/// <summary>
/// The first cost's depreciation applied to a later capital outlay: the same method, life, factor or MACRS class and
/// convention (with the first cost's quarter or month), to no salvage, since the salvage entered belongs to the first
/// cost. Under units of production an outlay is spread over the units still to come from its year. An outlay with a
/// class or life of its own keeps the first cost's method and takes that class or life instead.
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
        }, disposalYearShare, own => Own(spec, own, disposalYearShare));

    /// <summary>
    /// The rule for an outlay's own class or life, which <see cref="TaxSpecReader"/> has checked fits the method.
    /// Under MACRS the convention is the first cost's, except that real property takes the mid-month convention and
    /// other property cannot: a real-property outlay is placed in service in the first cost's month when the first
    /// cost is real property too, else in January (the default month of the first cost's own schedule), and disposed
    /// of in the first cost's month of disposal, else at the end of December, as the first cost is by default.
    /// Personal property under a real-property first cost takes the half-year convention.
    /// </summary>
    private static OutlayDepreciation Own(DepreciationSpec spec, OutlayClass own, double disposalYearShare)
    {
        if (spec.Method != DepreciationMethod.Macrs)
        {
            var firstCost = spec with { Life = own.Life };
            return Read(firstCost, disposalYearShare);
        }
        MacrsClass propertyClass = own.PropertyClass!.Value;
        MacrsConvention first = Convention(spec);
        bool real = propertyClass is MacrsClass.ResidentialRental or MacrsClass.Nonresidential;
        MacrsConvention convention = real ? MacrsConvention.MidMonth : first == MacrsConvention.MidMonth ? MacrsConvention.HalfYear : first;
        bool sameConvention = convention == first;
        int placed = sameConvention ? spec.PlacedInPeriod ?? 1 : 1;
        int periods = convention == MacrsConvention.MidMonth ? 12 : 4;
        int disposal = sameConvention ? spec.DisposalPeriod ?? periods : periods;
        return new((cost, _) => Macrs.Schedule(cost, propertyClass, convention, placed), Macrs.DisposalYearShare(convention, disposal));
    }

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
