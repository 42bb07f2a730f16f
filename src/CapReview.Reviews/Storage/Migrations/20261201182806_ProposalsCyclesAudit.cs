using System;
using Microsoft.EntityFrameworkCore.Migrations;

#nullable disable

namespace CapReview.Reviews.Storage.Migrations
{
    /// <inheritdoc />
    public partial class ProposalsCyclesAudit : Migration
    {
        /// <inheritdoc />
        protected override void Up(MigrationBuilder migrationBuilder)
        {
            migrationBuilder.CreateTable(
                name: "audit_event",
                columns: table => new
                {
                    Id = table.Column<long>(type: "INTEGER", nullable: false)
                        .Annotation("Sqlite:Autoincrement", true),
                    At = table.Column<DateTimeOffset>(type: "TEXT", nullable: false),
                    UserId = table.Column<string>(type: "TEXT", maxLength: 100, nullable: false),
                    Action = table.Column<string>(type: "TEXT", maxLength: 60, nullable: false),
                    EntityType = table.Column<string>(type: "TEXT", maxLength: 60, nullable: false),
                    EntityId = table.Column<string>(type: "TEXT", maxLength: 60, nullable: false),
                    Before = table.Column<string>(type: "TEXT", nullable: true),
                    After = table.Column<string>(type: "TEXT", nullable: true),
                    PreviousHash = table.Column<string>(type: "TEXT", maxLength: 64, nullable: false),
                    Hash = table.Column<string>(type: "TEXT", maxLength: 64, nullable: false)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_audit_event", x => x.Id);
                });

            migrationBuilder.CreateTable(
                name: "marr_policy_version",
                columns: table => new
                {
                    Id = table.Column<int>(type: "INTEGER", nullable: false)
                        .Annotation("Sqlite:Autoincrement", true),
                    Number = table.Column<int>(type: "INTEGER", nullable: false),
                    Rate = table.Column<double>(type: "REAL", nullable: false),
                    Basis = table.Column<string>(type: "TEXT", maxLength: 20, nullable: false),
                    CompoundingsPerYear = table.Column<int>(type: "INTEGER", nullable: false),
                    EffectiveFrom = table.Column<DateOnly>(type: "TEXT", nullable: false),
                    LowRiskPremium = table.Column<double>(type: "REAL", nullable: false),
                    StandardRiskPremium = table.Column<double>(type: "REAL", nullable: false),
                    HighRiskPremium = table.Column<double>(type: "REAL", nullable: false),
                    SetBy = table.Column<string>(type: "TEXT", maxLength: 100, nullable: false),
                    Reason = table.Column<string>(type: "TEXT", maxLength: 1000, nullable: false),
                    CreatedAt = table.Column<DateTimeOffset>(type: "TEXT", nullable: false)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_marr_policy_version", x => x.Id);
                });

            migrationBuilder.CreateTable(
                name: "budget_cycle",
                columns: table => new
                {
                    Id = table.Column<int>(type: "INTEGER", nullable: false)
                        .Annotation("Sqlite:Autoincrement", true),
                    Name = table.Column<string>(type: "TEXT", maxLength: 200, nullable: false),
                    CapitalLimit = table.Column<decimal>(type: "TEXT", precision: 18, scale: 2, nullable: false),
                    MarrPolicyVersionId = table.Column<int>(type: "INTEGER", nullable: false),
                    OpensOn = table.Column<DateOnly>(type: "TEXT", nullable: false),
                    ClosesOn = table.Column<DateOnly>(type: "TEXT", nullable: false),
                    Status = table.Column<string>(type: "TEXT", maxLength: 20, nullable: false),
                    RequiredSignOffs = table.Column<int>(type: "INTEGER", nullable: false),
                    Revision = table.Column<int>(type: "INTEGER", nullable: false)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_budget_cycle", x => x.Id);
                    table.ForeignKey(
                        name: "FK_budget_cycle_marr_policy_version_MarrPolicyVersionId",
                        column: x => x.MarrPolicyVersionId,
                        principalTable: "marr_policy_version",
                        principalColumn: "Id",
                        onDelete: ReferentialAction.Restrict);
                });

            migrationBuilder.CreateTable(
                name: "proposal",
                columns: table => new
                {
                    Id = table.Column<int>(type: "INTEGER", nullable: false)
                        .Annotation("Sqlite:Autoincrement", true),
                    Reference = table.Column<string>(type: "TEXT", maxLength: 20, nullable: false),
                    OwnerId = table.Column<string>(type: "TEXT", maxLength: 100, nullable: false),
                    Title = table.Column<string>(type: "TEXT", maxLength: 200, nullable: false),
                    Description = table.Column<string>(type: "TEXT", maxLength: 4000, nullable: false),
                    Category = table.Column<string>(type: "TEXT", maxLength: 20, nullable: false),
                    RiskClass = table.Column<string>(type: "TEXT", maxLength: 20, nullable: false),
                    Status = table.Column<string>(type: "TEXT", maxLength: 20, nullable: false),
                    BudgetCycleId = table.Column<int>(type: "INTEGER", nullable: true),
                    Revision = table.Column<int>(type: "INTEGER", nullable: false)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_proposal", x => x.Id);
                    table.ForeignKey(
                        name: "FK_proposal_budget_cycle_BudgetCycleId",
                        column: x => x.BudgetCycleId,
                        principalTable: "budget_cycle",
                        principalColumn: "Id",
                        onDelete: ReferentialAction.Restrict);
                });

            migrationBuilder.CreateTable(
                name: "proposal_version",
                columns: table => new
                {
                    Id = table.Column<int>(type: "INTEGER", nullable: false)
                        .Annotation("Sqlite:Autoincrement", true),
                    ProposalId = table.Column<int>(type: "INTEGER", nullable: false),
                    Number = table.Column<int>(type: "INTEGER", nullable: false),
                    AuthorId = table.Column<string>(type: "TEXT", maxLength: 100, nullable: false),
                    CreatedAt = table.Column<DateTimeOffset>(type: "TEXT", nullable: false),
                    Reason = table.Column<string>(type: "TEXT", maxLength: 1000, nullable: false),
                    IsFrozen = table.Column<bool>(type: "INTEGER", nullable: false),
                    FrozenAt = table.Column<DateTimeOffset>(type: "TEXT", nullable: true),
                    AssumptionsJson = table.Column<string>(type: "TEXT", nullable: false),
                    AssumptionsHash = table.Column<string>(type: "TEXT", maxLength: 64, nullable: false),
                    Revision = table.Column<int>(type: "INTEGER", nullable: false)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_proposal_version", x => x.Id);
                    table.ForeignKey(
                        name: "FK_proposal_version_proposal_ProposalId",
                        column: x => x.ProposalId,
                        principalTable: "proposal",
                        principalColumn: "Id",
                        onDelete: ReferentialAction.Restrict);
                });

            migrationBuilder.CreateIndex(
                name: "IX_audit_event_PreviousHash",
                table: "audit_event",
                column: "PreviousHash",
                unique: true);

            migrationBuilder.CreateIndex(
                name: "IX_budget_cycle_MarrPolicyVersionId",
                table: "budget_cycle",
                column: "MarrPolicyVersionId");

            migrationBuilder.CreateIndex(
                name: "IX_budget_cycle_Name",
                table: "budget_cycle",
                column: "Name",
                unique: true);

            migrationBuilder.CreateIndex(
                name: "IX_marr_policy_version_Number",
                table: "marr_policy_version",
                column: "Number",
                unique: true);

            migrationBuilder.CreateIndex(
                name: "IX_proposal_BudgetCycleId",
                table: "proposal",
                column: "BudgetCycleId");

            migrationBuilder.CreateIndex(
                name: "IX_proposal_OwnerId",
                table: "proposal",
                column: "OwnerId");

            migrationBuilder.CreateIndex(
                name: "IX_proposal_Reference",
                table: "proposal",
                column: "Reference",
                unique: true);

            migrationBuilder.CreateIndex(
                name: "IX_proposal_version_ProposalId_Number",
                table: "proposal_version",
                columns: new[] { "ProposalId", "Number" },
                unique: true);
        }

        /// <inheritdoc />
        protected override void Down(MigrationBuilder migrationBuilder)
        {
            migrationBuilder.DropTable(
                name: "audit_event");

            migrationBuilder.DropTable(
                name: "proposal_version");

            migrationBuilder.DropTable(
                name: "proposal");

            migrationBuilder.DropTable(
                name: "budget_cycle");

            migrationBuilder.DropTable(
                name: "marr_policy_version");
        }
    }
}
