using CapReview.Engine.CashFlows;
using CapReview.Engine.Factors;
using CapReview.Engine.Measures;

namespace CapReview.Engine.Comparison;

/// <summary>Worth over a board-set study period, with the basis it was computed on.</summary>
/// <param name="PresentWorth">PW of the flows within the study period plus the value at its end.</param>
/// <param name="PeriodWorth">The same as an equivalent amount per period over the study period.</param>
/// <param name="Basis">How the life was fitted to the study period, in words.</param>
public sealed record StudyPeriodResult(double PresentWorth, double PeriodWorth, string Basis);

/// <summary>
/// Present worth over a study period of T periods. Shorter than the life: the flows are cut at T and the asset's
/// estimated market value at T is received then (truncation). Longer: the life is renewed on the same terms as often
/// as needed and the renewal in service at T is cut there with its stated value (extension). A whole number of lives
/// needs no stated value.
/// Common practice, no source; see docs/methods.md.
/// </summary>
public static class StudyPeriodWorth
{
    public static StudyPeriodResult Compute(CashFlowModel model, double ratePerPeriod, int studyPeriod, double valueAtEnd)
    {
        ArgumentNullException.ThrowIfNull(model);
        int life = model.Horizon;
        if (studyPeriod < 1 || studyPeriod > CompoundInterest.MaxPeriods)
        {
            throw new ArgumentOutOfRangeException(nameof(studyPeriod), studyPeriod, "The study period must be between 1 and 1,200 periods.");
        }
        if (!double.IsFinite(valueAtEnd))
        {
            throw new ArgumentOutOfRangeException(nameof(valueAtEnd), valueAtEnd, "The value at the end of the study period must be a finite number.");
        }
        double[] window = Window(model, studyPeriod, valueAtEnd);
        string basis = studyPeriod % life == 0
            ? studyPeriod == life ? "the life itself" : $"{studyPeriod / life} lives of {life} periods, renewed on the same terms"
            : studyPeriod < life
                ? $"cut at period {studyPeriod} of a {life}-period life, with its market value then"
                : $"the {life}-period life renewed to cover {studyPeriod} periods, the last renewal valued at its end";
        double pw = FlowWorth.PresentWorth(window, ratePerPeriod);
        return new StudyPeriodResult(pw, pw * CompoundInterest.CapitalRecovery(ratePerPeriod, studyPeriod), basis);
    }

    /// <summary>
    /// The net flows of periods 0 … T on the study period's terms: the life renewed as often as needed and cut at T,
    /// with the value at the end added at T unless T is a whole number of lives (each then ends with its own resale).
    /// The ranking's worth over T and the incremental analysis over T both discount these flows.
    /// </summary>
    public static double[] Window(CashFlowModel model, int studyPeriod, double valueAtEnd)
    {
        ArgumentNullException.ThrowIfNull(model);
        int life = model.Horizon;
        // The renewals may run past period 1,200 (at most a life less one period); only the window up to T is kept.
        int covered = (studyPeriod + life - 1) / life * life;
        double[] flows = CommonHorizon.Repeat(model.NetFlows, covered);
        double[] window = new double[studyPeriod + 1];
        Array.Copy(flows, window, studyPeriod + 1);
        if (studyPeriod % life != 0)
        {
            window[studyPeriod] += valueAtEnd;
        }
        return window;
    }
}
