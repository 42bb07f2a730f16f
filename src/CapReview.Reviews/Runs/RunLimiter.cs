using System.Globalization;
using CapReview.Reviews.Access;
using CapReview.Reviews.Common;

namespace CapReview.Reviews.Runs;

/// <summary>
/// Counts the simulations and solver runs going on this server, by person and in all, and refuses one more than
/// <see cref="RunLimitOptions"/> allows (nothing waits in a queue: a refused person tries again); checks a run's work
/// against the budget before it starts. One instance a server, shared by the pages and the API, so that one person's
/// browser and tokens together hold no more than their share. Each server counts only its own runs.
/// </summary>
public sealed class RunLimiter(RunLimitOptions options)
{
    private readonly Lock _gate = new();
    private readonly Dictionary<string, int> _byPerson = new(StringComparer.Ordinal);
    private int _running;

    /// <summary>The limits in force.</summary>
    public RunLimitOptions Options { get; } = options ?? throw new ArgumentNullException(nameof(options));

    /// <summary>Runs going on this server now.</summary>
    public int Running
    {
        get
        {
            lock (_gate)
            {
                return _running;
            }
        }
    }

    /// <summary>Runs going for <paramref name="actor"/> now.</summary>
    public int RunningFor(Actor actor)
    {
        ArgumentNullException.ThrowIfNull(actor);
        lock (_gate)
        {
            return _byPerson.GetValueOrDefault(actor.UserId);
        }
    }

    /// <summary>
    /// A place for one run of <paramref name="actor"/>'s, to dispose when the run ends however it ends; throws
    /// <see cref="RunLimitReachedException"/>, saying which limit, when none is free.
    /// </summary>
    public RunLease Enter(Actor actor)
    {
        ArgumentNullException.ThrowIfNull(actor);
        lock (_gate)
        {
            int own = _byPerson.GetValueOrDefault(actor.UserId);
            if (own >= Options.PerPerson)
            {
                throw new RunLimitReachedException(string.Create(CultureInfo.InvariantCulture,
                    $"You already have {own} simulations or portfolio calculations running, the most one person may run at once: wait for one to finish, or stop it, and try again."));
            }
            if (_running >= Options.PerServer)
            {
                throw new RunLimitReachedException(string.Create(CultureInfo.InvariantCulture,
                    $"The server is already running {_running} simulations or portfolio calculations, as many as it runs at once: try again in a minute."));
            }
            _byPerson[actor.UserId] = own + 1;
            _running++;
        }
        return new RunLease(() => Leave(actor.UserId));
    }

    /// <summary>
    /// Refuses, naming <paramref name="field"/>, a run that asks for more than the work budget; <paramref name="what"/>
    /// says in words what is counted (e.g. "10,000 trials of 121 periods and 4 elements").
    /// </summary>
    public void CheckWork(long work, string field, string what)
    {
        if (work > Options.WorkBudget)
        {
            throw new RuleViolationException(string.Create(CultureInfo.InvariantCulture,
                $"{field}: {what} is {work:N0} units of work (trials × periods × elements); one run may do at most {Options.WorkBudget:N0}. Run fewer trials."));
        }
    }

    private void Leave(string person)
    {
        lock (_gate)
        {
            int own = _byPerson.GetValueOrDefault(person) - 1;
            if (own <= 0)
            {
                _byPerson.Remove(person);
            }
            else
            {
                _byPerson[person] = own;
            }
            _running--;
        }
    }
}
