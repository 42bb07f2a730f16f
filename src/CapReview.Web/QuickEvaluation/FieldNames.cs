using System.Globalization;
using System.Text.RegularExpressions;

namespace CapReview.Web.QuickEvaluation;

/// <summary>Field paths as people read them: <c>elements[2].amount</c> is "Element 3, amount".</summary>
public static partial class FieldNames
{
    public static string Describe(string field)
    {
        ArgumentNullException.ThrowIfNull(field);
        Match element = ElementPath().Match(field);
        if (element.Success)
        {
            int number = int.Parse(element.Groups[1].Value, CultureInfo.InvariantCulture) + 1;
            string part = element.Groups[2].Success ? ", " + Part(element.Groups[2].Value) : "";
            return $"Element {number.ToString(CultureInfo.InvariantCulture)}{part}";
        }
        return field switch
        {
            "rate.value" => "MARR",
            "rate.basis" => "Rate basis",
            "rate.compoundingsPerYear" => "Compoundings a year",
            "horizon" => "Horizon",
            "periodsPerYear" => "Period length",
            "elements" => "Elements",
            _ => field,
        };
    }

    private static string Part(string field) => field switch
    {
        "first" => "first period",
        "last" => "last period",
        "every" => "interval",
        _ => field,
    };

    [GeneratedRegex(@"^elements\[(\d+)\](?:\.(\w+))?$", RegexOptions.CultureInvariant)]
    private static partial Regex ElementPath();
}
