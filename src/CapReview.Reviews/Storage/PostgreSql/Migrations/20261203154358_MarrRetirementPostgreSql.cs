using System;
using Microsoft.EntityFrameworkCore.Migrations;
using Npgsql.EntityFrameworkCore.PostgreSQL.Metadata;

#nullable disable

namespace CapReview.Reviews.Storage.PostgreSql.Migrations
{
    /// <summary>
    /// The record that a MARR version was retired as a mistake, written once like the version it retires: the
    /// WriteOnceTriggers function refuses an update, delete or truncate inside PostgreSQL too.
    /// </summary>
    public partial class MarrRetirementPostgreSql : Migration
    {
        /// <inheritdoc />
        protected override void Up(MigrationBuilder migrationBuilder)
        {
            migrationBuilder.CreateTable(
                name: "marr_version_retirement",
                columns: table => new
                {
                    Id = table.Column<int>(type: "integer", nullable: false)
                        .Annotation("Npgsql:ValueGenerationStrategy", NpgsqlValueGenerationStrategy.IdentityByDefaultColumn),
                    MarrPolicyVersionId = table.Column<int>(type: "integer", nullable: false),
                    Reason = table.Column<string>(type: "character varying(1000)", maxLength: 1000, nullable: false),
                    RetiredBy = table.Column<string>(type: "character varying(100)", maxLength: 100, nullable: false),
                    RetiredAt = table.Column<DateTimeOffset>(type: "timestamp with time zone", nullable: false)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_marr_version_retirement", x => x.Id);
                    table.ForeignKey(
                        name: "FK_marr_version_retirement_marr_policy_version_MarrPolicyVersi~",
                        column: x => x.MarrPolicyVersionId,
                        principalTable: "marr_policy_version",
                        principalColumn: "Id",
                        onDelete: ReferentialAction.Restrict);
                });

            migrationBuilder.CreateIndex(
                name: "IX_marr_version_retirement_MarrPolicyVersionId",
                table: "marr_version_retirement",
                column: "MarrPolicyVersionId",
                unique: true);

            migrationBuilder.Sql("""
                CREATE TRIGGER marr_version_retirement_written_once BEFORE UPDATE OR DELETE ON marr_version_retirement
                FOR EACH ROW EXECUTE FUNCTION capreview_refuse_write_once();
                """);
            migrationBuilder.Sql("""
                CREATE TRIGGER marr_version_retirement_no_truncate BEFORE TRUNCATE ON marr_version_retirement
                FOR EACH STATEMENT EXECUTE FUNCTION capreview_refuse_write_once();
                """);
        }

        /// <inheritdoc />
        protected override void Down(MigrationBuilder migrationBuilder)
        {
            migrationBuilder.DropTable(
                name: "marr_version_retirement");
        }
    }
}
