namespace CapReview.Reviews.Common;

/// <summary>The cautions every export and packet carries, in one place so that they never drift apart.</summary>
public static class Cautions
{
    public const string Estimates =
        "Estimates, not advice: every figure is an estimate from the assumptions entered. Tax and depreciation rules vary by jurisdiction and year. " +
        "Decisions follow the organisation's finance policy and the advice of licensed professionals.";
}
