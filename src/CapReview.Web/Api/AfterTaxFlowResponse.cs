namespace CapReview.Web.Api;

/// <summary>One year of the after-tax table (see methods.md): taxable income is the operating gain less depreciation, plus a gain over book value at disposal.</summary>
public sealed record AfterTaxFlowResponse(int Period, double BeforeTax, double Depreciation, double TaxableIncome, double LossUsed, double Tax, double Credit, double AfterTax, double Equity);
