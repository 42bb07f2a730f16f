using System.Collections.Concurrent;
using Microsoft.Extensions.Logging;

namespace CapReview.Browser.Tests;

/// <summary>
/// The warnings and errors the app under test logs, with their exceptions, so that a test can show why a page failed
/// (a dead circuit shows in the browser only as a page that never goes live) and can require a clean log.
/// </summary>
public sealed class ServerLog : ILoggerProvider
{
    private readonly ConcurrentQueue<string> _entries = new();

    public IReadOnlyList<string> Entries => [.. _entries];

    /// <summary>The errors so far, one per line with its exception; empty when there were none.</summary>
    public string Errors(LogLevel atLeast = LogLevel.Error) =>
        string.Join(Environment.NewLine, _entries.Where(e => Level(e) >= atLeast));

    public ILogger CreateLogger(string categoryName) => new Logger(this, categoryName);

    public void Dispose()
    {
    }

    private static LogLevel Level(string entry) => Enum.Parse<LogLevel>(entry[..entry.IndexOf(' ', StringComparison.Ordinal)]);

    private sealed class Logger(ServerLog log, string category) : ILogger
    {
        public IDisposable? BeginScope<TState>(TState state) where TState : notnull => null;

        public bool IsEnabled(LogLevel logLevel) => logLevel >= LogLevel.Warning;

        public void Log<TState>(LogLevel logLevel, EventId eventId, TState state, Exception? exception, Func<TState, Exception?, string> formatter)
        {
            if (IsEnabled(logLevel))
            {
                log._entries.Enqueue($"{logLevel} {category}: {formatter(state, exception)}{(exception is null ? "" : Environment.NewLine + exception)}");
            }
        }
    }
}
