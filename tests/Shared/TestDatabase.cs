using CapReview.Reviews.Storage;
using Npgsql;

namespace CapReview.TestSupport;

/// <summary>
/// A test's own database: a SQLite file in its folder, or, when CAPREVIEW_TEST_POSTGRES names a PostgreSQL server
/// (Host=…;Username=…;Password=…, a role allowed to create databases), a fresh database on it, dropped afterwards.
/// CI runs the domain and API suites both ways.
/// </summary>
public sealed class TestDatabase : IAsyncDisposable
{
    private readonly string? _server;
    private readonly string _name;

    public static string? PostgreSqlServer => Environment.GetEnvironmentVariable("CAPREVIEW_TEST_POSTGRES") is { Length: > 0 } server ? server : null;

    public DatabaseSettings Settings { get; }

    public bool IsPostgreSql => _server is not null;

    private TestDatabase(string? server, string name, DatabaseSettings settings)
    {
        _server = server;
        _name = name;
        Settings = settings;
    }

    /// <summary>A new database; on SQLite the file <paramref name="sqliteFile"/> (made on first use).</summary>
    public static TestDatabase Create(string sqliteFile)
    {
        if (PostgreSqlServer is not { } server)
        {
            return new TestDatabase(null, sqliteFile, DatabaseSettings.Sqlite($"Data Source={sqliteFile};Pooling=False"));
        }
        string name = "capreview_test_" + Guid.NewGuid().ToString("N")[..12];
        using (var connection = new NpgsqlConnection(new NpgsqlConnectionStringBuilder(server) { Database = "postgres" }.ConnectionString))
        {
            connection.Open();
            using var create = connection.CreateCommand();
            create.CommandText = $"CREATE DATABASE \"{name}\"";
            create.ExecuteNonQuery();
        }
        return new TestDatabase(server, name, new DatabaseSettings(DatabaseProvider.PostgreSql,
            new NpgsqlConnectionStringBuilder(server) { Database = name }.ConnectionString));
    }

    public async ValueTask DisposeAsync()
    {
        if (_server is null)
        {
            return;
        }
        NpgsqlConnection.ClearAllPools();
        await using var connection = new NpgsqlConnection(new NpgsqlConnectionStringBuilder(_server) { Database = "postgres" }.ConnectionString);
        await connection.OpenAsync();
        await using var drop = connection.CreateCommand();
        drop.CommandText = $"DROP DATABASE IF EXISTS \"{_name}\" WITH (FORCE)";
        await drop.ExecuteNonQueryAsync();
    }
}
