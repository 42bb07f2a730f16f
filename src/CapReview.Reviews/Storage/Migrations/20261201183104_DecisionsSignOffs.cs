using System;
using Microsoft.EntityFrameworkCore.Migrations;

#nullable disable

namespace CapReview.Reviews.Storage.Migrations
{
    /// <inheritdoc />
    public partial class DecisionsSignOffs : Migration
    {
        /// <inheritdoc />
        protected override void Up(MigrationBuilder migrationBuilder)
        {
            migrationBuilder.CreateTable(
                name: "decision",
                columns: table => new
                {
                    Id = table.Column<int>(type: "INTEGER", nullable: false)
                        .Annotation("Sqlite:Autoincrement", true),
                    ProposalId = table.Column<int>(type: "INTEGER", nullable: false),
                    BudgetCycleId = table.Column<int>(type: "INTEGER", nullable: false),
                    VersionNumber = table.Column<int>(type: "INTEGER", nullable: false),
                    AssumptionsHash = table.Column<string>(type: "TEXT", maxLength: 64, nullable: false),
                    MarrPolicyVersionId = table.Column<int>(type: "INTEGER", nullable: false),
                    Outcome = table.Column<string>(type: "TEXT", maxLength: 20, nullable: false),
                    Conditions = table.Column<string>(type: "TEXT", maxLength: 2000, nullable: false),
                    DecidedBy = table.Column<string>(type: "TEXT", maxLength: 100, nullable: false),
                    DecidedAt = table.Column<DateTimeOffset>(type: "TEXT", nullable: false)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_decision", x => x.Id);
                    table.ForeignKey(
                        name: "FK_decision_budget_cycle_BudgetCycleId",
                        column: x => x.BudgetCycleId,
                        principalTable: "budget_cycle",
                        principalColumn: "Id",
                        onDelete: ReferentialAction.Restrict);
                    table.ForeignKey(
                        name: "FK_decision_proposal_ProposalId",
                        column: x => x.ProposalId,
                        principalTable: "proposal",
                        principalColumn: "Id",
                        onDelete: ReferentialAction.Restrict);
                });

            migrationBuilder.CreateTable(
                name: "sign_off",
                columns: table => new
                {
                    Id = table.Column<int>(type: "INTEGER", nullable: false)
                        .Annotation("Sqlite:Autoincrement", true),
                    BudgetCycleId = table.Column<int>(type: "INTEGER", nullable: false),
                    UserId = table.Column<string>(type: "TEXT", maxLength: 100, nullable: false),
                    DisplayName = table.Column<string>(type: "TEXT", maxLength: 200, nullable: false),
                    SignedAt = table.Column<DateTimeOffset>(type: "TEXT", nullable: false),
                    DecisionsSigned = table.Column<string>(type: "TEXT", nullable: false)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_sign_off", x => x.Id);
                    table.ForeignKey(
                        name: "FK_sign_off_budget_cycle_BudgetCycleId",
                        column: x => x.BudgetCycleId,
                        principalTable: "budget_cycle",
                        principalColumn: "Id",
                        onDelete: ReferentialAction.Restrict);
                });

            migrationBuilder.CreateIndex(
                name: "IX_decision_BudgetCycleId",
                table: "decision",
                column: "BudgetCycleId");

            migrationBuilder.CreateIndex(
                name: "IX_decision_ProposalId",
                table: "decision",
                column: "ProposalId");

            migrationBuilder.CreateIndex(
                name: "IX_sign_off_BudgetCycleId_UserId",
                table: "sign_off",
                columns: new[] { "BudgetCycleId", "UserId" },
                unique: true);
        }

        /// <inheritdoc />
        protected override void Down(MigrationBuilder migrationBuilder)
        {
            migrationBuilder.DropTable(
                name: "decision");

            migrationBuilder.DropTable(
                name: "sign_off");
        }
    }
}
