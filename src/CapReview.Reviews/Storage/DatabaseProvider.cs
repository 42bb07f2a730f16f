namespace CapReview.Reviews.Storage;

/// <summary>The database engines CapReview runs on: SQLite embedded (the default), PostgreSQL for larger installations.</summary>
public enum DatabaseProvider
{
    Sqlite,
    PostgreSql,
}
