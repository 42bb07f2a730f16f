using CapReview.Reviews.Access;
using CapReview.Reviews.Interchange;

namespace CapReview.Reviews.Tests;

/// <summary>The test actors as the installation's people directory: their ids and names, an e-mail made from the id.</summary>
internal sealed class KnownPeople(IEnumerable<Actor> actors) : IPeopleDirectory
{
    private readonly Dictionary<string, KnownPerson> _people = actors.ToDictionary(a => a.UserId, a => new KnownPerson(a.UserId, a.DisplayName, a.UserId + "@tarnby.example"));

    public Task<KnownPerson?> FindAsync(string userId, CancellationToken cancellationToken) => Task.FromResult(_people.GetValueOrDefault(userId));

    public Task<KnownPerson?> FindByEmailAsync(string email, CancellationToken cancellationToken) =>
        Task.FromResult(_people.Values.FirstOrDefault(p => string.Equals(p.Email, email, StringComparison.OrdinalIgnoreCase)));
}
