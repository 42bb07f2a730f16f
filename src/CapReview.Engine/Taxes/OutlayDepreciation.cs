using CapReview.Engine.Depreciation;

namespace CapReview.Engine.Taxes;

/// <summary>
/// How a capital outlay after the first cost (an overhaul, an addition) is depreciated as an asset of its own: the
/// proposal's method applied to the outlay's cost, placed in service in the outlay's year.
/// </summary>
/// <param name="ScheduleFor">The schedule of a cost (the first argument) placed in service in a year (the second, 1 or later); its tax year 1 is that year.</param>
/// <param name="DisposalYearShare">The share of the disposal year's depreciation allowed, as for the first cost.</param>
/// <param name="Own">The rule for an outlay with a class or life of its own (<see cref="OutlayClass"/>); null when none may be given.</param>
public sealed record OutlayDepreciation(Func<double, int, DepreciationSchedule> ScheduleFor, double DisposalYearShare, Func<OutlayClass, OutlayDepreciation>? Own = null)
{
    /// <summary>The rule for an outlay depreciated as <paramref name="depreciatedAs"/>; for null, the first cost's.</summary>
    public OutlayDepreciation For(OutlayClass? depreciatedAs) => depreciatedAs is null || Own is null ? this : Own(depreciatedAs);
}
