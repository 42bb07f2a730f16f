using System;
using Microsoft.EntityFrameworkCore.Migrations;

#nullable disable

namespace CapReview.Reviews.Storage.Migrations
{
    /// <summary>
    /// The record that a MARR version was retired as a mistake, written once like the version it retires: triggers
    /// refuse an update or delete inside SQLite too (written out here, as in WriteOnceTriggers).
    /// </summary>
    public partial class MarrRetirement : Migration
    {
        /// <inheritdoc />
        protected override void Up(MigrationBuilder migrationBuilder)
        {
            migrationBuilder.CreateTable(
                name: "marr_version_retirement",
                columns: table => new
                {
                    Id = table.Column<int>(type: "INTEGER", nullable: false)
                        .Annotation("Sqlite:Autoincrement", true),
                    MarrPolicyVersionId = table.Column<int>(type: "INTEGER", nullable: false),
                    Reason = table.Column<string>(type: "TEXT", maxLength: 1000, nullable: false),
                    RetiredBy = table.Column<string>(type: "TEXT", maxLength: 100, nullable: false),
                    RetiredAt = table.Column<DateTimeOffset>(type: "TEXT", nullable: false)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_marr_version_retirement", x => x.Id);
                    table.ForeignKey(
                        name: "FK_marr_version_retirement_marr_policy_version_MarrPolicyVersionId",
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
                CREATE TRIGGER "marr_version_retirement_written_once_update" BEFORE UPDATE ON "marr_version_retirement"
                BEGIN SELECT RAISE(ABORT, 'marr_version_retirement rows are written once: update refused'); END;
                """);
            migrationBuilder.Sql("""
                CREATE TRIGGER "marr_version_retirement_written_once_delete" BEFORE DELETE ON "marr_version_retirement"
                BEGIN SELECT RAISE(ABORT, 'marr_version_retirement rows are written once: delete refused'); END;
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
