using System.Data.Common;
using Microsoft.EntityFrameworkCore.Diagnostics;

namespace CapReview.Packets.Tests;

/// <summary>
/// A disk that fills up: while limited, every connection may grow the SQLite file by only so many pages, and a write
/// beyond them fails exactly as on a full disk (SQLITE_FULL, "database or disk is full").
/// </summary>
public sealed class FullDisk : DbConnectionInterceptor
{
    private volatile int _limitPages;

    /// <summary>Lets the file grow by <paramref name="freePages"/> more pages of its current size at most.</summary>
    public void Fill(DbConnection connection, int freePages)
    {
        ArgumentNullException.ThrowIfNull(connection);
        using DbCommand count = connection.CreateCommand();
        count.CommandText = "PRAGMA page_count";
        _limitPages = Convert.ToInt32(count.ExecuteScalar(), System.Globalization.CultureInfo.InvariantCulture) + freePages;
    }

    public void Free() => _limitPages = 0;

    public override void ConnectionOpened(DbConnection connection, ConnectionEndEventData eventData) => Limit(connection);

    public override Task ConnectionOpenedAsync(DbConnection connection, ConnectionEndEventData eventData, CancellationToken cancellationToken = default)
    {
        Limit(connection);
        return Task.CompletedTask;
    }

    private void Limit(DbConnection connection)
    {
        int limit = _limitPages;
        using DbCommand pragma = connection.CreateCommand();
        // SQLite's own ceiling when free: the largest page count it accepts.
        pragma.CommandText = $"PRAGMA max_page_count = {(limit > 0 ? limit : 4294967294)}";
        pragma.ExecuteNonQuery();
    }
}
