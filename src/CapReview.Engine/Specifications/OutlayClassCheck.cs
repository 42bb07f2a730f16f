using CapReview.Engine.CashFlows;
using CapReview.Engine.Depreciation;
using CapReview.Engine.Validation;

namespace CapReview.Engine.Specifications;

/// <summary>
/// Whether each outlay's own class or life fits the first cost's method: a MACRS property class under MACRS, a life
/// under the book methods, and neither under units of production, where an outlay is spread over the units to come.
/// </summary>
internal static class OutlayClassCheck
{
    public static void Check(DepreciationSpec firstCost, CashFlowModel model, List<InputError> errors)
    {
        for (int e = 0; e < model.Elements.Count; e++)
        {
            if (model.Elements[e].DepreciatedAs is not { } own)
            {
                continue;
            }
            string field = $"elements[{e}].depreciatedAs";
            switch (firstCost.Method)
            {
                case DepreciationMethod.Macrs when own.PropertyClass is null:
                    errors.Add(new(field, "The first cost is depreciated by MACRS: choose a MACRS property class."));
                    break;
                case DepreciationMethod.UnitsOfProduction:
                    errors.Add(new(field, "Under units of production an outlay is spread over the units to come: leave this to the first cost's method."));
                    break;
                case not DepreciationMethod.Macrs when own.Life is not int:
                    errors.Add(new(field, "The first cost is depreciated over a life: give a life of 1 to 100 years."));
                    break;
                case DepreciationMethod.DecliningBalance when own.Life < (firstCost.Factor ?? 2.0):
                    errors.Add(new(field, "The declining-balance factor is more than this life: give a life of at least the factor."));
                    break;
            }
        }
    }
}
