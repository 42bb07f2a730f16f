using Microsoft.EntityFrameworkCore.Migrations;

#nullable disable

namespace CapReview.Reviews.Storage.Migrations
{
    /// <inheritdoc />
    public partial class IntegrityRecords : Migration
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
                    Id = table.Column<int>(type: "INTEGER", nullable: false)
                        .Annotation("Sqlite:Autoincrement", true),
                    BudgetCycleId = table.Column<int>(type: "INTEGER", nullable: false),
                    DocumentSha256 = table.Column<string>(type: "TEXT", maxLength: 64, nullable: false),
                    Installation = table.Column<string>(type: "TEXT", maxLength: 200, nullable: false),
                    ImportedBy = table.Column<string>(type: "TEXT", maxLength: 100, nullable: false),
                    ImportedByName = table.Column<string>(type: "TEXT", maxLength: 200, nullable: false),
                    ImportedAt = table.Column<DateTimeOffset>(type: "TEXT", nullable: false)
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
                type: "TEXT",
                maxLength: 40,
                nullable: true);

            migrationBuilder.AddColumn<long>(
                name: "AuditEventCount",
                table: "approval_packet",
                type: "INTEGER",
                nullable: true);

            migrationBuilder.AddColumn<string>(
                name: "AuditHeadHash",
                table: "approval_packet",
                type: "TEXT",
                maxLength: 64,
                nullable: true);

            migrationBuilder.AddColumn<string>(
                name: "Signature",
                table: "cycle_import",
                type: "TEXT",
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
