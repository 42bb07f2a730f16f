using Microsoft.EntityFrameworkCore.Migrations;
using Npgsql.EntityFrameworkCore.PostgreSQL.Metadata;

#nullable disable

namespace CapReview.Reviews.Storage.PostgreSql.Migrations
{
    /// <inheritdoc />
    public partial class IntegrityRecordsPostgreSql : Migration
    {
        /// <inheritdoc />
        protected override void Up(MigrationBuilder migrationBuilder)
        {
            migrationBuilder.DropIndex(
                name: "IX_sign_off_BudgetCycleId_UserId",
                table: "sign_off");

            migrationBuilder.CreateIndex(
                name: "IX_sign_off_BudgetCycleId_UserId",
                table: "sign_off",
                columns: new[] { "BudgetCycleId", "UserId" });

            migrationBuilder.CreateTable(
                name: "cycle_import",
                columns: table => new
                {
                    Id = table.Column<int>(type: "integer", nullable: false)
                        .Annotation("Npgsql:ValueGenerationStrategy", NpgsqlValueGenerationStrategy.IdentityByDefaultColumn),
                    BudgetCycleId = table.Column<int>(type: "integer", nullable: false),
                    DocumentSha256 = table.Column<string>(type: "character varying(64)", maxLength: 64, nullable: false),
                    Installation = table.Column<string>(type: "character varying(200)", maxLength: 200, nullable: false),
                    ImportedBy = table.Column<string>(type: "character varying(100)", maxLength: 100, nullable: false),
                    ImportedByName = table.Column<string>(type: "character varying(200)", maxLength: 200, nullable: false),
                    ImportedAt = table.Column<DateTimeOffset>(type: "timestamp with time zone", nullable: false)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_cycle_import", x => x.Id);
                    table.ForeignKey(
                        name: "FK_cycle_import_budget_cycle_BudgetCycleId",
                        column: x => x.BudgetCycleId,
                        principalTable: "budget_cycle",
                        principalColumn: "Id",
                        onDelete: ReferentialAction.Restrict);
                });

            migrationBuilder.CreateIndex(
                name: "IX_cycle_import_BudgetCycleId",
                table: "cycle_import",
                column: "BudgetCycleId",
                unique: true);

            migrationBuilder.AddColumn<string>(
                name: "KeyId",
                table: "audit_event",
                type: "character varying(40)",
                maxLength: 40,
                nullable: true);

            migrationBuilder.AddColumn<long>(
                name: "AuditEventCount",
                table: "approval_packet",
                type: "bigint",
                nullable: true);

            migrationBuilder.AddColumn<string>(
                name: "AuditHeadHash",
                table: "approval_packet",
                type: "character varying(64)",
                maxLength: 64,
                nullable: true);

            migrationBuilder.AddColumn<string>(
                name: "Signature",
                table: "cycle_import",
                type: "character varying(400)",
                maxLength: 400,
                nullable: false,
                defaultValue: "");
        }

        /// <inheritdoc />
        protected override void Down(MigrationBuilder migrationBuilder)
        {
            migrationBuilder.DropColumn(
                name: "Signature",
                table: "cycle_import");

            migrationBuilder.DropColumn(
                name: "KeyId",
                table: "audit_event");

            migrationBuilder.DropColumn(
                name: "AuditEventCount",
                table: "approval_packet");

            migrationBuilder.DropColumn(
                name: "AuditHeadHash",
                table: "approval_packet");

            migrationBuilder.DropTable(
                name: "cycle_import");

            migrationBuilder.DropIndex(
                name: "IX_sign_off_BudgetCycleId_UserId",
                table: "sign_off");

            migrationBuilder.CreateIndex(
                name: "IX_sign_off_BudgetCycleId_UserId",
                table: "sign_off",
                columns: new[] { "BudgetCycleId", "UserId" },
                unique: true);
        }
    }
}
