using System.Globalization;
using CapReview.Reviews.Portfolio;

namespace CapReview.Web.Api;

/// <summary>
/// The what-if settings of a ranking or portfolio request, read from its query: <c>shift</c> (MARR points, −10 to 10),
/// <c>limit</c> (capital now), <c>objective</c> (presentWorth or annualWorth) and <c>basis</c> (beforeTax or afterTax).
/// </summary>
public static class WhatIfQuery
{
    /// <summary>The page's query for the same what-if, e.g. <c>?shift=2&amp;limit=1500000</c>.</summary>
    public static string Write(double shiftPoints, decimal? limit, SelectionObjective? objective, bool afterTax = false)
    {
        var parts = new List<string>();
        if (afterTax)
        {
            parts.Add("basis=afterTax");
        }
        if (shiftPoints != 0)
        {
            parts.Add("shift=" + shiftPoints.ToString(CultureInfo.InvariantCulture));
        }
        if (limit is decimal l)
        {
            parts.Add("limit=" + l.ToString(CultureInfo.InvariantCulture));
        }
        if (objective is SelectionObjective o)
        {
            parts.Add("objective=" + (o == SelectionObjective.AnnualWorth ? "annualWorth" : "presentWorth"));
        }
        return parts.Count == 0 ? "" : "?" + string.Join("&", parts);
    }

    public static bool TryRead(IQueryCollection q, out PortfolioQuery query, out IResult? problem)
    {
        query = new PortfolioQuery();
        problem = null;
        if (q.TryGetValue("shift", out var shiftText))
        {
            if (!double.TryParse(shiftText, NumberStyles.Float, CultureInfo.InvariantCulture, out double points) || !double.IsFinite(points) || Math.Abs(points) > 10)
            {
                problem = Invalid("shift", "Give the MARR shift in percentage points, between −10 and 10.");
                return false;
            }
            query = query with { MarrShift = points / 100 };
        }
        if (q.TryGetValue("limit", out var limitText))
        {
            if (!decimal.TryParse(limitText, NumberStyles.Number, CultureInfo.InvariantCulture, out decimal limit) || limit < 0)
            {
                problem = Invalid("limit", "Give the capital limit as a number, zero or more.");
                return false;
            }
            query = query with { CapitalLimit = limit };
        }
        if (q.TryGetValue("basis", out var basisText))
        {
            if (basisText.ToString() is not ("afterTax" or "beforeTax"))
            {
                problem = Invalid("basis", "Choose beforeTax or afterTax.");
                return false;
            }
            query = query with { AfterTax = basisText.ToString() == "afterTax" };
        }
        if (q.TryGetValue("objective", out var objectiveText))
        {
            SelectionObjective? objective = objectiveText.ToString() switch
            {
                "presentWorth" => SelectionObjective.PresentWorth,
                "annualWorth" => SelectionObjective.AnnualWorth,
                _ => null,
            };
            if (objective is null)
            {
                problem = Invalid("objective", "Choose presentWorth or annualWorth.");
                return false;
            }
            query = query with { Objective = objective };
        }
        return true;
    }

    private static IResult Invalid(string field, string message) =>
        ApiProblems.Invalid(field, message, "The request's settings could not be read.");
}
