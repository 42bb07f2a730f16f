using Microsoft.EntityFrameworkCore.Migrations;

#nullable disable

namespace CapReview.Reviews.Storage.Migrations
{
    /// <summary>
    /// Triggers that refuse, inside SQLite itself, an update or delete of a row written once, so that a bulk
    /// ExecuteUpdate/ExecuteDelete or raw SQL cannot do what the entities and the save interceptor refuse. A proposal
    /// version is guarded once frozen: a draft may still be edited, and the update that freezes it sees a draft.
    /// The SQL is written out here, not shared with code, so that this migration means the same forever. A later
    /// migration that rebuilds one of these tables (SQLite's way of altering a column) drops its triggers and must
    /// create them again.
    /// </summary>
    public partial class WriteOnceTriggers : Migration
    {
        private static readonly string[] WrittenOnce = ["decision", "sign_off", "marr_policy_version", "audit_event", "approval_packet"];

        /// <inheritdoc />
        protected override void Up(MigrationBuilder migrationBuilder)
        {
            foreach (string table in WrittenOnce)
            {
                migrationBuilder.Sql($"""
                    CREATE TRIGGER "{table}_written_once_update" BEFORE UPDATE ON "{table}"
                    BEGIN SELECT RAISE(ABORT, '{table} rows are written once: update refused'); END;
                    """);
                migrationBuilder.Sql($"""
                    CREATE TRIGGER "{table}_written_once_delete" BEFORE DELETE ON "{table}"
                    BEGIN SELECT RAISE(ABORT, '{table} rows are written once: delete refused'); END;
                    """);
            }
            migrationBuilder.Sql("""
                CREATE TRIGGER "proposal_version_written_once_update" BEFORE UPDATE ON "proposal_version" WHEN OLD."IsFrozen"
                BEGIN SELECT RAISE(ABORT, 'a frozen proposal_version is written once: update refused'); END;
                """);
            migrationBuilder.Sql("""
                CREATE TRIGGER "proposal_version_written_once_delete" BEFORE DELETE ON "proposal_version" WHEN OLD."IsFrozen"
                BEGIN SELECT RAISE(ABORT, 'a frozen proposal_version is written once: delete refused'); END;
                """);
        }

        /// <inheritdoc />
        protected override void Down(MigrationBuilder migrationBuilder)
        {
            foreach (string table in WrittenOnce.Append("proposal_version"))
            {
                migrationBuilder.Sql($"DROP TRIGGER IF EXISTS \"{table}_written_once_update\";");
                migrationBuilder.Sql($"DROP TRIGGER IF EXISTS \"{table}_written_once_delete\";");
            }
        }
    }
}
