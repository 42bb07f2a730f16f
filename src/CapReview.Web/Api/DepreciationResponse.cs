namespace CapReview.Web.Api;

/// <summary>The depreciation schedule: the method in words, the basis, each tax year's amount and the book value at its end.</summary>
public sealed record DepreciationResponse(string Method, double Basis, IReadOnlyList<double> Amounts, IReadOnlyList<double> BookValues);
