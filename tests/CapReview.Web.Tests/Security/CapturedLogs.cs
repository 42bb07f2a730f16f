using System.Collections.Concurrent;
using Microsoft.Extensions.Logging;

namespace CapReview.Web.Tests.Security;

/// <summary>Every log entry the app writes: its category, event id, message, the values of its state and its exception in full.</summary>
public sealed class CapturedLogs : ILoggerProvider
{
    public sealed record Entry(string Category, int EventId, string Message, string Text);

    private readonly ConcurrentQueue<Entry> _entries = new();

    public IReadOnlyCollection<Entry> Entries => _entries;

    public ILogger CreateLogger(string categoryName) => new Logger(categoryName, _entries);

    public void Dispose()
    {
    }

    private sealed class Logger(string category, ConcurrentQueue<Entry> entries) : ILogger
    {
        public IDisposable? BeginScope<TState>(TState state) where TState : notnull => null;

        public bool IsEnabled(LogLevel logLevel) => true;

        public void Log<TState>(LogLevel logLevel, EventId eventId, TState state, Exception? exception, Func<TState, Exception?, string> formatter)
        {
            string message = formatter(state, exception);
            string values = state is IEnumerable<KeyValuePair<string, object?>> pairs ? string.Join(" ", pairs.Select(p => $"{p.Key}={p.Value}")) : "";
            entries.Enqueue(new Entry(category, eventId.Id, message, $"{category} {message} {values} {exception}"));
        }
    }
}
