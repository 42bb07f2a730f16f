using CapReview.Engine.Rates;

namespace CapReview.Engine.Evaluation;

/// <summary>
/// What a model is evaluated at: the MARR, and optionally the finance and reinvestment rates of the external rate of
/// return (both default to the MARR).
/// </summary>
public sealed record EvaluationOptions(AnnualRate Marr, AnnualRate? FinanceRate = null, AnnualRate? ReinvestmentRate = null);
