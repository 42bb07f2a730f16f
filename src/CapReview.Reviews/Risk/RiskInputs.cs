using CapReview.Engine.Specifications;

namespace CapReview.Reviews.Risk;

/// <summary>
/// The inputs of a model a lead may name as uncertain, with their labels. Elements are named by their identity, so a
/// parameter keeps its element when elements are reordered, inserted or deleted.
/// </summary>
public static class RiskInputs
{
    public static IEnumerable<(string Target, string Label)> Of(ModelSpec? model, TaxSpec? tax)
    {
        yield return ("rate", "MARR");
        yield return ("horizon", "Life, periods");
        for (int e = 0; e < (model?.Elements?.Count ?? 0); e++)
        {
            ElementSpec? element = model!.Elements![e];
            string name = $"{e + 1}. {element?.Label}";
            string Target(string field) => element?.Id is { } id ? ElementIdentity.Target(id, field) : $"elements[{e}].{field}";
            yield return (Target("amount"), $"{name}: amount");
            if (element?.Type == ElementKind.Arithmetic)
            {
                yield return (Target("step"), $"{name}: step");
            }
            if (element?.Type == ElementKind.Geometric)
            {
                yield return (Target("growth"), $"{name}: growth");
            }
            if (element?.Type is ElementKind.Uniform or ElementKind.Arithmetic or ElementKind.Geometric)
            {
                yield return (Target("last"), $"{name}: last period");
            }
        }
        if (model?.Inflation is not null)
        {
            yield return ("inflation.rate", "General inflation");
        }
        if (tax is not null)
        {
            yield return ("tax.incomeTaxRate", "Income-tax rate");
        }
    }

    /// <summary>The label of <paramref name="target"/> in the model (by identity or position), or the target itself when it names no input of it.</summary>
    public static string Label(string target, ModelSpec? model, TaxSpec? tax)
    {
        ArgumentNullException.ThrowIfNull(target);
        string? resolved = ElementIdentity.Resolve(target, model?.Elements);
        return Of(model, tax).Where(i => ElementIdentity.Resolve(i.Target, model?.Elements) == resolved).Select(i => i.Label).FirstOrDefault() ?? target;
    }
}
