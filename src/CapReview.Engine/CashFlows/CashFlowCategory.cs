namespace CapReview.Engine.CashFlows;

/// <summary>What a cash-flow element represents; the benefit-cost ratio groups flows by it.</summary>
public enum CashFlowCategory
{
    /// <summary>First cost, overhauls and other investment outlays.</summary>
    Capital,

    /// <summary>Operating and maintenance costs (or, with a positive sign, reductions of them).</summary>
    Operating,

    /// <summary>Revenues and savings: the benefits of the proposal.</summary>
    Revenue,

    /// <summary>Salvage or market value recovered at disposal.</summary>
    Salvage,

    /// <summary>Income taxes and tax credits.</summary>
    Tax,
}
