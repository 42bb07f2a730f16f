using Microsoft.EntityFrameworkCore;

namespace CapReview.Reviews.Storage;

/// <summary>Which database an installation uses and how to reach it; the one place a context is pointed at its engine.</summary>
public sealed record DatabaseSettings(DatabaseProvider Provider, string ConnectionString)
{
    public static DatabaseSettings Sqlite(string connectionString) => new(DatabaseProvider.Sqlite, connectionString);

    /// <summary>Points <paramref name="options"/> at the engine, with its own migration history table when one is named.</summary>
    public DbContextOptionsBuilder Apply(DbContextOptionsBuilder options, string? migrationsHistoryTable = null)
    {
        ArgumentNullException.ThrowIfNull(options);
        return Provider switch
        {
            DatabaseProvider.PostgreSql => options.UseNpgsql(ConnectionString, npgsql =>
            {
                if (migrationsHistoryTable is not null)
                {
                    npgsql.MigrationsHistoryTable(migrationsHistoryTable);
                }
            }),
            _ => options.UseSqlite(ConnectionString, sqlite =>
            {
                if (migrationsHistoryTable is not null)
                {
                    sqlite.MigrationsHistoryTable(migrationsHistoryTable);
                }
            }),
        };
    }
}
