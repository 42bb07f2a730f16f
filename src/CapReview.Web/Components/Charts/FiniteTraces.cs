using System.Reflection;
using Plotly.Blazor;

namespace CapReview.Web.Components.Charts;

/// <summary>
/// The one guard between figures and the chart library: the JSON a chart is sent in cannot carry NaN or infinity
/// (the circuit fails writing it), so every non-finite number of a trace's data becomes a gap (null). A figure that no
/// double can hold is a missing bar or a break in a line, never a page that dies. <see cref="PlotFrame"/>, which every
/// chart draws through, applies it.
/// </summary>
public static class FiniteTraces
{
    /// <summary>The trace itself, with each non-finite number in its data lists and number properties replaced by null.</summary>
    public static ITrace Of(ITrace trace)
    {
        ArgumentNullException.ThrowIfNull(trace);
        foreach (PropertyInfo property in trace.GetType().GetProperties(BindingFlags.Public | BindingFlags.Instance))
        {
            if (!property.CanRead || !property.CanWrite || property.GetIndexParameters().Length > 0)
            {
                continue;
            }
            object? value = property.GetValue(trace);
            if (value is IList<object> list)
            {
                for (int k = 0; k < list.Count; k++)
                {
                    if (!Finite(list[k]))
                    {
                        list[k] = null!;
                    }
                }
            }
            else if (property.PropertyType == typeof(object) && !Finite(value))
            {
                property.SetValue(trace, null);
            }
            else if (value is double d && !double.IsFinite(d) && Nullable.GetUnderlyingType(property.PropertyType) == typeof(double))
            {
                property.SetValue(trace, null);
            }
        }
        return trace;
    }

    private static bool Finite(object? value) => value switch
    {
        double d => double.IsFinite(d),
        float f => float.IsFinite(f),
        _ => true,
    };
}
