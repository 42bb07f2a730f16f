using Microsoft.EntityFrameworkCore.Migrations;

#nullable disable

namespace CapReview.Reviews.Storage.Migrations
{
    /// <inheritdoc />
    public partial class PortfolioRules : Migration
    {
        /// <inheritdoc />
        protected override void Up(MigrationBuilder migrationBuilder)
        {
            migrationBuilder.AddColumn<string>(
                name: "LaterYearLimits",
                table: "budget_cycle",
                type: "TEXT",
                nullable: false,
                defaultValue: "[]");

            migrationBuilder.AddColumn<string>(
                name: "Objective",
                table: "budget_cycle",
                type: "TEXT",
                maxLength: 20,
                nullable: false,
                defaultValue: "PresentWorth");

            migrationBuilder.AddColumn<int>(
                name: "StudyPeriodYears",
                table: "budget_cycle",
                type: "INTEGER",
                nullable: true);

            migrationBuilder.CreateTable(
                name: "contingency",
                columns: table => new
                {
                    Id = table.Column<int>(type: "INTEGER", nullable: false)
                        .Annotation("Sqlite:Autoincrement", true),
                    BudgetCycleId = table.Column<int>(type: "INTEGER", nullable: false),
                    DependentProposalId = table.Column<int>(type: "INTEGER", nullable: false),
                    PrerequisiteProposalId = table.Column<int>(type: "INTEGER", nullable: false)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_contingency", x => x.Id);
                    table.ForeignKey(
                        name: "FK_contingency_budget_cycle_BudgetCycleId",
                        column: x => x.BudgetCycleId,
                        principalTable: "budget_cycle",
                        principalColumn: "Id",
                        onDelete: ReferentialAction.Restrict);
                    table.ForeignKey(
                        name: "FK_contingency_proposal_DependentProposalId",
                        column: x => x.DependentProposalId,
                        principalTable: "proposal",
                        principalColumn: "Id",
                        onDelete: ReferentialAction.Restrict);
                    table.ForeignKey(
                        name: "FK_contingency_proposal_PrerequisiteProposalId",
                        column: x => x.PrerequisiteProposalId,
                        principalTable: "proposal",
                        principalColumn: "Id",
                        onDelete: ReferentialAction.Restrict);
                });

            migrationBuilder.CreateTable(
                name: "exclusive_group",
                columns: table => new
                {
                    Id = table.Column<int>(type: "INTEGER", nullable: false)
                        .Annotation("Sqlite:Autoincrement", true),
                    BudgetCycleId = table.Column<int>(type: "INTEGER", nullable: false),
                    Name = table.Column<string>(type: "TEXT", maxLength: 100, nullable: false),
                    Mandatory = table.Column<bool>(type: "INTEGER", nullable: false),
                    ProposalIds = table.Column<string>(type: "TEXT", nullable: false)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_exclusive_group", x => x.Id);
                    table.ForeignKey(
                        name: "FK_exclusive_group_budget_cycle_BudgetCycleId",
                        column: x => x.BudgetCycleId,
                        principalTable: "budget_cycle",
                        principalColumn: "Id",
                        onDelete: ReferentialAction.Restrict);
                });

            migrationBuilder.CreateIndex(
                name: "IX_contingency_BudgetCycleId_DependentProposalId_PrerequisiteProposalId",
                table: "contingency",
                columns: new[] { "BudgetCycleId", "DependentProposalId", "PrerequisiteProposalId" },
                unique: true);

            migrationBuilder.CreateIndex(
                name: "IX_contingency_DependentProposalId",
                table: "contingency",
                column: "DependentProposalId");

            migrationBuilder.CreateIndex(
                name: "IX_contingency_PrerequisiteProposalId",
                table: "contingency",
                column: "PrerequisiteProposalId");

            migrationBuilder.CreateIndex(
                name: "IX_exclusive_group_BudgetCycleId_Name",
                table: "exclusive_group",
                columns: new[] { "BudgetCycleId", "Name" },
                unique: true);
        }

        /// <inheritdoc />
        protected override void Down(MigrationBuilder migrationBuilder)
        {
            migrationBuilder.DropTable(
                name: "contingency");

            migrationBuilder.DropTable(
                name: "exclusive_group");

            migrationBuilder.DropColumn(
                name: "LaterYearLimits",
                table: "budget_cycle");

            migrationBuilder.DropColumn(
                name: "Objective",
                table: "budget_cycle");

            migrationBuilder.DropColumn(
                name: "StudyPeriodYears",
                table: "budget_cycle");
        }
    }
}
