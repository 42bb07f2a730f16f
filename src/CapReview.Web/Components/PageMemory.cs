using System.Globalization;
using System.Text.Json;
using CapReview.Reviews.Access;
using CapReview.Reviews.Preferences;

namespace CapReview.Web.Components;

/// <summary>
/// A page's settings kept for the user between visits (a ranking's filters and sort, a portfolio's what-if) and the
/// cycle they last opened. A stored value that no longer reads is ignored: the page opens with its defaults.
/// </summary>
public sealed class PageMemory(PreferenceService preferences)
{
    public async Task<T?> LoadAsync<T>(Actor actor, string name)
        where T : class
    {
        string? json = await preferences.GetAsync(actor, name, CancellationToken.None).ConfigureAwait(false);
        if (json is null)
        {
            return null;
        }
        try
        {
            return JsonSerializer.Deserialize<T>(json);
        }
        catch (JsonException)
        {
            return null;
        }
    }

    public Task SaveAsync<T>(Actor actor, string name, T value) =>
        preferences.SetAsync(actor, name, JsonSerializer.Serialize(value), CancellationToken.None);

    public Task RememberCycleAsync(Actor actor, int cycleId) =>
        preferences.SetAsync(actor, PreferenceService.LastCycle, cycleId.ToString(CultureInfo.InvariantCulture), CancellationToken.None);

    public async Task<int?> LastCycleAsync(Actor actor)
    {
        string? value = await preferences.GetAsync(actor, PreferenceService.LastCycle, CancellationToken.None).ConfigureAwait(false);
        return int.TryParse(value, NumberStyles.None, CultureInfo.InvariantCulture, out int id) ? id : null;
    }
}
