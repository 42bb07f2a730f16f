using Microsoft.EntityFrameworkCore.Migrations;

#nullable disable

namespace CapReview.Reviews.Storage.PostgreSql.Migrations
{
    /// <summary>
    /// Triggers that refuse, inside PostgreSQL itself, an update, delete or truncate of a row written once, so that a
    /// bulk ExecuteUpdate/ExecuteDelete or raw SQL cannot do what the entities and the save interceptor refuse
    /// (TRUNCATE fires no row trigger, hence the statement triggers). A proposal version is guarded once frozen: a draft
    /// may still be edited, and the update that freezes it sees a draft. The SQL is written out here, not shared with
    /// code, so that this migration means the same forever.
    /// </summary>
    public partial class WriteOnceTriggers : Migration
    {
        private static readonly string[] WrittenOnce = ["decision", "sign_off", "marr_policy_version", "audit_event", "approval_packet"];

        /// <inheritdoc />
        protected override void Up(MigrationBuilder migrationBuilder)
        {
            migrationBuilder.Sql("""
                CREATE FUNCTION capreview_refuse_write_once() RETURNS trigger LANGUAGE plpgsql AS $$
                BEGIN
                    RAISE EXCEPTION '% rows are written once: % refused', TG_TABLE_NAME, lower(TG_OP);
                END
                $$;
                """);
            foreach (string table in WrittenOnce)
            {
                migrationBuilder.Sql($"""
                    CREATE TRIGGER {table}_written_once BEFORE UPDATE OR DELETE ON {table}
                    FOR EACH ROW EXECUTE FUNCTION capreview_refuse_write_once();
                    """);
            }
            migrationBuilder.Sql("""
                CREATE TRIGGER proposal_version_written_once BEFORE UPDATE OR DELETE ON proposal_version
                FOR EACH ROW WHEN (OLD."IsFrozen") EXECUTE FUNCTION capreview_refuse_write_once();
                """);
            foreach (string table in WrittenOnce.Append("proposal_version"))
            {
                migrationBuilder.Sql($"""
                    CREATE TRIGGER {table}_no_truncate BEFORE TRUNCATE ON {table}
                    FOR EACH STATEMENT EXECUTE FUNCTION capreview_refuse_write_once();
                    """);
            }
        }

        /// <inheritdoc />
        protected override void Down(MigrationBuilder migrationBuilder)
        {
            foreach (string table in WrittenOnce.Append("proposal_version"))
            {
                migrationBuilder.Sql($"DROP TRIGGER IF EXISTS {table}_written_once ON {table};");
                migrationBuilder.Sql($"DROP TRIGGER IF EXISTS {table}_no_truncate ON {table};");
            }
            migrationBuilder.Sql("DROP FUNCTION IF EXISTS capreview_refuse_write_once();");
        }
    }
}
