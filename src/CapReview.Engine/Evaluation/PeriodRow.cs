using CapReview.Engine.CashFlows;

namespace CapReview.Engine.Evaluation;

/// <summary>
/// One period of an evaluated model: the flow of each category, the net flow, its (P/F, i, t) factor at the MARR per
/// period, its present worth and the present worth of every flow up to it (which crosses zero at the discounted payback).
/// </summary>
public sealed record PeriodRow(int Period, IReadOnlyDictionary<CashFlowCategory, double> ByCategory, double Net, double Factor, double PresentWorth,
    double CumulativePresentWorth);
