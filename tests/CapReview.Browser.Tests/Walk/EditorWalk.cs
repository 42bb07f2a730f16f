using System.Globalization;
using Microsoft.Playwright;

namespace CapReview.Browser.Tests.Walk;

/// <summary>
/// Random but valid-looking actions in the proposal editor, chosen by a seeded generator from what the walk knows of
/// the page (its own shadow of the elements, parameters, correlations, scenarios and the tax switch), never from the
/// page's timing: one seed gives one sequence of actions. Each action waits for the page to show its effect before
/// the next is chosen, so an action never lands on a row that is about to go.
/// </summary>
public sealed class EditorWalk(IPage page, int seed)
{
    private static readonly string[] Kinds = ["Single", "Uniform", "Arithmetic", "Geometric", "Recurring"];
    private static readonly string[] Distributions = ["Uniform", "Triangular", "Pert", "Normal", "Discrete"];
    private static readonly string[] Methods = ["Macrs", "StraightLine", "DecliningBalance", "SumOfYearsDigits", "UnitsOfProduction"];
    private static readonly string[] Words = ["Press", "Spare parts", "Energy saved", "Overhaul", "Operators", "Resale", "Licence", "Tooling", "Scrap avoided"];

    private readonly Random random = new(seed);
    private readonly List<Element> elements = [];
    private readonly List<Parameter> parameters = [];
    private int correlations, scenarios;
    private bool tax;
    private string method = "Macrs";

    public List<string> Log { get; } = [];

    /// <summary>The rows the walk starts from, as the draft was stored.</summary>
    public void Starts(params (string Kind, string Label, int Last)[] rows) =>
        elements.AddRange(rows.Select(r => new Element(r.Kind, r.Label) { Last = r.Last }));

    private ILocator Risk => page.Locator("section[aria-labelledby=risk-heading]");

    /// <summary>Chooses and performs one action; returns what it did, in words, for the log.</summary>
    public async Task StepAsync(int number)
    {
        var choices = new List<(int Weight, string Name, Func<Task<string>> Act)>
        {
            (elements.Count < 9 ? 6 : 1, "add element", AddElementAsync),
            (elements.Count > 1 ? 3 : 0, "remove element", RemoveElementAsync),
            (elements.Count > 1 ? 4 : 0, "move element", MoveElementAsync),
            (elements.Count > 0 ? 5 : 0, "change shape", ShapeAsync),
            (elements.Count > 0 ? 14 : 0, "type in the grid", GridFieldAsync),
            (elements.Count > 0 ? 2 : 0, "money basis", MoneyAsync),
            (elements.Count > 0 ? 3 : 0, "a typing mistake, corrected", MistakeAsync),
            (3, "tax switch", TaxSwitchAsync),
            (tax ? 5 : 0, "tax field", TaxFieldAsync),
            (parameters.Count < 4 ? 6 : 0, "add parameter", AddParameterAsync),
            (parameters.Count > 0 ? 3 : 0, "remove parameter", RemoveParameterAsync),
            (parameters.Count > 0 ? (parameters.Any(p => !Valid(p)) ? 12 : 4) : 0, "parameter input", TargetAsync),
            (parameters.Count > 0 ? 10 : 0, "low / likely / high", RangeAsync),
            (parameters.Count > 0 ? 4 : 0, "distribution", DistributionAsync),
            (parameters.Count >= 2 ? 3 : 0, "add correlation", AddCorrelationAsync),
            (correlations > 0 ? 4 : 0, "correlation", CorrelationAsync),
            (parameters.Count > 0 && scenarios < 4 ? 3 : 0, "add scenario", AddScenarioAsync),
            (scenarios > 0 ? 4 : 0, "scenario value", ScenarioAsync),
            (parameters.Count > 0 ? 5 : 0, "run the simulation", RunAsync),
            (parameters.Count > 0 ? 3 : 0, "run and cancel", RunAndCancelAsync),
            (1, "save", SaveAsync),
        };
        int total = choices.Sum(c => c.Weight);
        int pick = random.Next(total);
        foreach (var (weight, name, act) in choices)
        {
            if (pick < weight)
            {
                Log.Add($"{number}: {name}: (started)");
                int line = Log.Count - 1;
                Log[line] = $"{number}: {name}: {await act()}";
                return;
            }
            pick -= weight;
        }
    }

    private async Task<string> AddElementAsync()
    {
        string kind = Pick(Kinds);
        await page.Locator("#new-element-type").SelectOptionAsync(kind);
        await page.GetByRole(AriaRole.Button, new() { Name = "Add element", Exact = true }).ClickAsync();
        elements.Add(new Element(kind, $"Element {elements.Count + 1}") { Last = Horizon });
        await RowsAsync();
        return kind;
    }

    private async Task<string> RemoveElementAsync()
    {
        int e = random.Next(elements.Count);
        await page.GetByRole(AriaRole.Button, new() { Name = $"Remove element {e + 1}", Exact = true }).ClickAsync();
        elements.RemoveAt(e);
        await RowsAsync();
        return $"element {e + 1}";
    }

    private async Task<string> MoveElementAsync()
    {
        int e = random.Next(elements.Count);
        bool up = e == elements.Count - 1 || (e > 0 && random.Next(2) == 0);
        await page.GetByRole(AriaRole.Button, new() { Name = $"Move element {e + 1} {(up ? "up" : "down")}", Exact = true }).ClickAsync();
        int target = up ? e - 1 : e + 1;
        (elements[e], elements[target]) = (elements[target], elements[e]);
        await RowsAsync();
        return $"element {e + 1} {(up ? "up" : "down")}";
    }

    private async Task<string> ShapeAsync()
    {
        int e = random.Next(elements.Count);
        string kind = Pick(Kinds);
        await page.Locator($"#el-{e}-type").SelectOptionAsync(kind);
        elements[e].Kind = kind;
        return $"element {e + 1} → {kind}";
    }

    private async Task<string> GridFieldAsync()
    {
        int e = random.Next(elements.Count);
        var element = elements[e];
        var fields = new List<string> { "label", "amount" };
        fields.AddRange(element.Kind == "Single" ? ["period"] : ["first", "last"]);
        if (element.Kind == "Arithmetic")
        {
            fields.Add("step");
        }
        if (element.Kind == "Geometric")
        {
            fields.Add("growth");
        }
        if (element.Kind == "Recurring")
        {
            fields.Add("every");
        }
        string field = Pick(fields);
        string value = field switch
        {
            "label" => Pick(Words) + " " + random.Next(1, 99).ToString(CultureInfo.InvariantCulture),
            "amount" => Money(),
            "period" => random.Next(0, Horizon + 1).ToString(CultureInfo.InvariantCulture),
            "first" => random.Next(1, element.Last + 1).ToString(CultureInfo.InvariantCulture),
            "last" => random.Next(element.First, Horizon + 1).ToString(CultureInfo.InvariantCulture),
            "step" => (random.Next(-40, 41) * 50).ToString(CultureInfo.InvariantCulture),
            "growth" => Pick(["-2", "0", "1.5", "3", "4.25", "8", "12"]),
            "every" => random.Next(1, 4).ToString(CultureInfo.InvariantCulture),
            _ => Pick(["", "1", "2.5", "4"]),
        };
        switch (field)
        {
            case "label":
                element.Label = value;
                break;
            case "first":
                element.First = int.Parse(value, CultureInfo.InvariantCulture);
                break;
            case "last":
                element.Last = int.Parse(value, CultureInfo.InvariantCulture);
                break;
        }
        var input = page.Locator($"#el-{e}-{field}");
        await input.FillAsync(value);
        await input.BlurAsync();
        return $"element {e + 1} {field} = “{value}”";
    }

    /// <summary>Constant money with an escalation, and back: the editor has no general inflation to make it whole.</summary>
    private async Task<string> MoneyAsync()
    {
        int e = random.Next(elements.Count);
        string escalation = Pick(["", "1", "2.5", "4"]);
        await page.Locator($"#el-{e}-money").SelectOptionAsync("Constant");
        await FillAsync(page.Locator($"#el-{e}-escalation"), escalation);
        await page.Locator($"#el-{e}-money").SelectOptionAsync("Actual");
        await Assertions.Expect(page.Locator($"#el-{e}-escalation")).ToHaveCountAsync(0);
        return $"element {e + 1} in constant money escalating “{escalation}” %, then actual again";
    }

    /// <summary>A value that is not one, which the field must name, then the value it had.</summary>
    private async Task<string> MistakeAsync()
    {
        int e = random.Next(elements.Count);
        var element = elements[e];
        var (field, before) = element.Kind == "Single"
            ? Pick<(string, string)>([("amount", "0"), ("period", "0")])
            : Pick<(string, string)>([("amount", "0"), ("first", element.First.ToString(CultureInfo.InvariantCulture)), ("last", element.Last.ToString(CultureInfo.InvariantCulture))]);
        string wrong = Pick(["abc", "", "1..2", "–", "12 000x", "1e400"]);
        var input = page.Locator($"#el-{e}-{field}");
        await FillAsync(input, wrong);
        await Assertions.Expect(input).ToHaveAttributeAsync("aria-invalid", "true");
        await FillAsync(input, before);
        await Assertions.Expect(input).ToHaveAttributeAsync("aria-invalid", "false");
        return $"element {e + 1} {field} “{wrong}”, then “{before}”";
    }

    private async Task<string> TaxSwitchAsync()
    {
        tax = !tax;
        var box = page.Locator("#tax-enabled");
        await box.SetCheckedAsync(tax);
        if (!tax)
        {
            foreach (var p in parameters.Where(p => p.Target == "tax"))
            {
                p.Target = "";
            }
        }
        return tax ? "on" : "off";
    }

    private async Task<string> TaxFieldAsync()
    {
        switch (random.Next(3))
        {
            case 0:
                string rate = Pick(["21", "25", "30", "35.5", "0"]);
                await FillAsync(page.Locator("#income-tax"), rate);
                return $"income tax {rate} %";
            case 1:
                method = Pick(Methods);
                await page.Locator("#depreciation-method").SelectOptionAsync(method);
                return $"depreciation {method}";
            default:
                if (method is "StraightLine" or "DecliningBalance" or "SumOfYearsDigits")
                {
                    string life = random.Next(3, 12).ToString(CultureInfo.InvariantCulture);
                    await FillAsync(page.Locator("#depreciation-life"), life);
                    return $"depreciation life {life}";
                }
                string after = Pick(["", "6", "7.5"]);
                await FillAsync(page.Locator("#after-tax-marr"), after);
                return $"after-tax MARR “{after}”";
        }
    }

    private async Task<string> AddParameterAsync()
    {
        await page.GetByTestId("add-parameter").ClickAsync();
        parameters.Add(new Parameter());
        await ParametersAsync();
        return $"parameter {parameters.Count}, {await TargetAsync(parameters.Count - 1)}";
    }

    private async Task<string> RemoveParameterAsync()
    {
        int p = random.Next(parameters.Count);
        await page.GetByRole(AriaRole.Button, new() { Name = $"Remove parameter {p + 1}", Exact = true }).ClickAsync();
        parameters.RemoveAt(p);
        await ParametersAsync();
        // The correlations name parameters, and the names shift: a lead sets them again.
        for (; correlations > 0; correlations--)
        {
            await Risk.Locator(".year-limits").First.GetByRole(AriaRole.Button, new() { Name = "Remove" }).ClickAsync();
            await Assertions.Expect(Risk.Locator("[aria-label^='Coefficient of correlation']")).ToHaveCountAsync(correlations - 1);
        }
        return $"parameter {p + 1}, and the correlations";
    }

    private bool Valid(Parameter p) => p.Target switch
    {
        "" => false,
        "rate" or "life" => true,
        "tax" => tax,
        "step" => elements.Contains(p.Element!) && p.Element!.Kind == "Arithmetic",
        "growth" => elements.Contains(p.Element!) && p.Element!.Kind == "Geometric",
        _ => elements.Contains(p.Element!),
    };

    private Task<string> TargetAsync()
    {
        // Mostly mends a parameter whose input went (its element removed or reshaped, tax off), as a lead would.
        var broken = Enumerable.Range(0, parameters.Count).Where(k => !Valid(parameters[k])).ToList();
        return TargetAsync(broken.Count > 0 && random.Next(4) > 0 ? Pick(broken) : random.Next(parameters.Count));
    }

    private async Task<string> TargetAsync(int p)
    {
        // The life and the last periods once took the page down when a value left the elements outside the life.
        var inputs = new List<(string Label, string Target, Element? Element)> { ("MARR", "rate", null), ("Life, periods", "life", null) };
        for (int e = 0; e < elements.Count; e++)
        {
            string name = $"{e + 1}. {elements[e].Label}";
            inputs.Add(($"{name}: amount", "amount", elements[e]));
            if (elements[e].Kind is "Uniform" or "Arithmetic" or "Geometric")
            {
                inputs.Add(($"{name}: last period", "last", elements[e]));
            }
            if (elements[e].Kind == "Arithmetic")
            {
                inputs.Add(($"{name}: step", "step", elements[e]));
            }
            if (elements[e].Kind == "Geometric")
            {
                inputs.Add(($"{name}: growth", "growth", elements[e]));
            }
        }
        if (tax)
        {
            inputs.Add(("Income-tax rate", "tax", null));
        }
        var (label, target, element) = Pick(inputs);
        await page.Locator($"#risk-target-{p}").SelectOptionAsync(new SelectOptionValue { Label = label });
        (parameters[p].Target, parameters[p].Element) = (target, element);
        return $"parameter {p + 1} on “{label}”";
    }

    private async Task<string> RangeAsync()
    {
        int p = random.Next(parameters.Count);
        // Rates are typed in percent, as everywhere on the page.
        double[] values = parameters[p].Target switch
        {
            "rate" => random.Next(2) == 0 ? [7, 9, 12] : [6, 9, 14],
            "life" => [6, 8, 10],
            "last" => [4, 7, 10],
            "growth" => random.Next(2) == 0 ? [0, 3.5, 7] : [-1, 3, 7],
            "tax" => [18, 25, 32],
            "step" => [-800, 0, 600],
            _ => [-60_000, 12_000, 90_000 + random.Next(0, 5) * 1_000],
        };
        // Every order, and all three equal; two times in three in order, so that the figures can be computed.
        int[][] orders = [[0, 2, 1], [1, 0, 2], [1, 2, 0], [2, 0, 1], [2, 1, 0], [1, 1, 1]];
        int[] order = random.Next(3) > 0 ? [0, 1, 2] : orders[random.Next(orders.Length)];
        string[] typed = [.. order.Select(k => values[k].ToString(CultureInfo.InvariantCulture))];
        await FillAsync(page.Locator($"#risk-low-{p}"), typed[0]);
        await FillAsync(page.Locator($"#risk-likely-{p}"), typed[1]);
        await FillAsync(page.Locator($"#risk-high-{p}"), typed[2]);
        return $"parameter {p + 1}: {string.Join(" / ", typed)}";
    }

    private async Task<string> DistributionAsync()
    {
        int p = random.Next(parameters.Count);
        string kind = Pick(Distributions);
        await Risk.GetByLabel($"Distribution of parameter {p + 1}", new() { Exact = true }).SelectOptionAsync(kind);
        if (kind == "Discrete")
        {
            string outcomes = Pick(["10000 : 0.5; 30000 : 0.5", "0.08 : 0.3; 0.1 : 0.7", "1 : 1"]);
            await FillAsync(Risk.GetByLabel($"Values and probabilities of parameter {p + 1}", new() { Exact = true }), outcomes);
            return $"parameter {p + 1} {kind}: {outcomes}";
        }
        return $"parameter {p + 1} {kind}";
    }

    private async Task<string> AddCorrelationAsync()
    {
        await Risk.GetByRole(AriaRole.Button, new() { Name = "Add a correlation", Exact = true }).ClickAsync();
        correlations++;
        await Assertions.Expect(Risk.Locator("[aria-label^='Coefficient of correlation']")).ToHaveCountAsync(correlations);
        return $"correlation {correlations}";
    }

    private async Task<string> CorrelationAsync()
    {
        int c = random.Next(correlations);
        if (random.Next(5) == 0 || parameters.Count == 0)
        {
            await Risk.Locator(".year-limits").Nth(c).GetByRole(AriaRole.Button, new() { Name = "Remove" }).ClickAsync();
            correlations--;
            await Assertions.Expect(Risk.Locator("[aria-label^='Coefficient of correlation']")).ToHaveCountAsync(correlations);
            return $"correlation {c + 1} removed";
        }
        int first = random.Next(parameters.Count), second = random.Next(parameters.Count);
        if (first == second && random.Next(10) > 0)
        {
            second = (first + 1) % parameters.Count;
        }
        string coefficient = Pick(["0.5", "-0.3", "0.7", "0", "-0.6", "1"]);
        await Risk.GetByLabel($"First parameter of correlation {c + 1}", new() { Exact = true }).SelectOptionAsync(new SelectOptionValue { Index = first });
        await Risk.GetByLabel($"Second parameter of correlation {c + 1}", new() { Exact = true }).SelectOptionAsync(new SelectOptionValue { Index = second });
        await FillAsync(Risk.GetByLabel($"Coefficient of correlation {c + 1}", new() { Exact = true }), coefficient);
        return $"correlation {c + 1}: parameters {first + 1} and {second + 1}, {coefficient}";
    }

    private async Task<string> AddScenarioAsync()
    {
        await Risk.GetByTestId("add-scenario").ClickAsync();
        scenarios++;
        await Assertions.Expect(Risk.Locator("[data-testid=named-scenarios] tbody tr")).ToHaveCountAsync(scenarios);
        await FillAsync(Risk.GetByLabel($"Name of scenario {scenarios}", new() { Exact = true }), Pick(["Dry year", "Strike", "Boom", "Late start"]));
        return $"scenario {scenarios}";
    }

    private async Task<string> ScenarioAsync()
    {
        int s = random.Next(scenarios);
        var row = Risk.Locator("[data-testid=named-scenarios] tbody tr").Nth(s);
        if (random.Next(6) == 0 || parameters.Count == 0)
        {
            await row.GetByRole(AriaRole.Button, new() { Name = "Remove" }).ClickAsync();
            scenarios--;
            await Assertions.Expect(Risk.Locator("[data-testid=named-scenarios] tbody tr")).ToHaveCountAsync(scenarios);
            return $"scenario {s + 1} removed";
        }
        int p = random.Next(parameters.Count);
        string value = parameters[p].Target switch
        {
            "rate" => Pick(["5", "12", ""]),
            "growth" or "tax" => Pick(["2", "30", ""]),
            _ => Pick(["-20000", "45000", "0", ""]),
        };
        await FillAsync(row.Locator("td").Nth(p + 1).Locator("input"), value);
        return $"scenario {s + 1}, parameter {p + 1} = “{value}”";
    }

    private async Task<string> RunAsync()
    {
        string trials = Pick(["200", "1000", "2500"]);
        await FillAsync(page.Locator("#risk-trials"), trials);
        var run = page.GetByTestId("run-simulation");
        if (!await ReadyAsync())
        {
            return $"{trials} trials; not run (the risk inputs have errors, or a run is going on)";
        }
        await run.ClickAsync();
        Runs++;
        return $"{trials} trials";
    }

    private async Task<string> RunAndCancelAsync()
    {
        await FillAsync(page.Locator("#risk-trials"), "300000");
        var run = page.GetByTestId("run-simulation");
        if (!await ReadyAsync())
        {
            return "not run (the risk inputs have errors, or a run is going on)";
        }
        await run.ClickAsync();
        Runs++;
        var cancel = Risk.GetByRole(AriaRole.Button, new() { Name = "Cancel", Exact = true });
        try
        {
            await cancel.ClickAsync(new() { Timeout = 2_000 });
            return "started and cancelled";
        }
        catch (TimeoutException)
        {
            return "started; over (or refused) before it could be cancelled";
        }
    }

    /// <summary>The number of simulations started.</summary>
    public int Runs { get; private set; }

    /// <summary>Waits for the risk analysis of the latest edit: the run button enabled, or the inputs' errors listed.</summary>
    private async Task<bool> ReadyAsync()
    {
        try
        {
            await page.Locator("[data-testid=run-simulation]:enabled, [data-testid=risk-errors]").First.WaitForAsync(new() { Timeout = 5_000 });
        }
        catch (TimeoutException)
        {
            return false;
        }
        if (await page.GetByTestId("run-simulation").IsEnabledAsync())
        {
            return true;
        }
        Log.Add("   risk errors: " + string.Join(" | ", await page.GetByTestId("risk-errors").AllInnerTextsAsync()));
        return false;
    }

    private async Task<string> SaveAsync()
    {
        await page.GetByRole(AriaRole.Button, new() { Name = "Save draft" }).ClickAsync();
        await Assertions.Expect(page.GetByTestId("editor-message")).ToBeVisibleAsync();
        string said = await page.GetByTestId("editor-message").InnerTextAsync();
        if (said == "Saved." && !tax)
        {
            // Saved before tax, the tax settings are not kept: they come back as a new form's.
            method = "Macrs";
        }
        if (said == "Saved." && parameters.Count == 0)
        {
            // Without a parameter there is no risk analysis to store: its correlations and scenarios go with it.
            (correlations, scenarios) = (0, 0);
            await Assertions.Expect(Risk.Locator("[data-testid=named-scenarios] tbody tr")).ToHaveCountAsync(0);
        }
        return said;
    }

    /// <summary>The grid shows the walk's rows, in its order.</summary>
    private async Task RowsAsync()
    {
        await Assertions.Expect(page.GetByTestId("element-row")).ToHaveCountAsync(elements.Count);
        for (int e = 0; e < elements.Count; e++)
        {
            await Assertions.Expect(page.Locator($"#el-{e}-label")).ToHaveValueAsync(elements[e].Label);
        }
    }

    private Task ParametersAsync() =>
        Assertions.Expect(Risk.Locator("[data-testid=risk-parameters] tbody tr:not(.drift-row)")).ToHaveCountAsync(parameters.Count);

    private static async Task FillAsync(ILocator input, string value)
    {
        await input.FillAsync(value);
        await input.BlurAsync();
    }

    private string Money() => random.Next(4) switch
    {
        0 => (-random.Next(1, 40) * 5_000).ToString(CultureInfo.InvariantCulture),
        1 => (random.Next(1, 30) * 1_000).ToString(CultureInfo.InvariantCulture),
        2 => (random.Next(-500_000, 500_000) / 100.0).ToString(CultureInfo.InvariantCulture),
        _ => "0",
    };

    private T Pick<T>(IReadOnlyList<T> options) => options[random.Next(options.Count)];

    private const int Horizon = 10;

    private sealed class Element(string kind, string label)
    {
        public string Kind { get; set; } = kind;

        public string Label { get; set; } = label;

        public int First { get; set; } = 1;

        public int Last { get; set; } = 1;
    }

    private sealed class Parameter
    {
        public string Target { get; set; } = "";

        public Element? Element { get; set; }
    }
}
