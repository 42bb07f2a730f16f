using System;
using Microsoft.EntityFrameworkCore.Migrations;

#nullable disable

namespace CapReview.Reviews.Storage.Migrations
{
    /// <inheritdoc />
    public partial class ApprovalPackets : Migration
    {
        /// <inheritdoc />
        protected override void Up(MigrationBuilder migrationBuilder)
        {
            migrationBuilder.CreateTable(
                name: "approval_packet",
                columns: table => new
                {
                    Id = table.Column<int>(type: "INTEGER", nullable: false)
                        .Annotation("Sqlite:Autoincrement", true),
                    Kind = table.Column<string>(type: "TEXT", maxLength: 20, nullable: false),
                    BudgetCycleId = table.Column<int>(type: "INTEGER", nullable: false),
                    ProposalId = table.Column<int>(type: "INTEGER", nullable: true),
                    VersionNumber = table.Column<int>(type: "INTEGER", nullable: true),
                    AssumptionsHash = table.Column<string>(type: "TEXT", maxLength: 64, nullable: true),
                    MarrPolicyVersionId = table.Column<int>(type: "INTEGER", nullable: false),
                    FileName = table.Column<string>(type: "TEXT", maxLength: 200, nullable: false),
                    FileSha256 = table.Column<string>(type: "TEXT", maxLength: 64, nullable: false),
                    Content = table.Column<byte[]>(type: "BLOB", nullable: false),
                    CreatedAt = table.Column<DateTimeOffset>(type: "TEXT", nullable: false),
                    CertificateSubject = table.Column<string>(type: "TEXT", maxLength: 400, nullable: false),
                    CertificateThumbprint = table.Column<string>(type: "TEXT", maxLength: 64, nullable: false),
                    DevelopmentCertificate = table.Column<bool>(type: "INTEGER", nullable: false)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_approval_packet", x => x.Id);
                    table.ForeignKey(
                        name: "FK_approval_packet_budget_cycle_BudgetCycleId",
                        column: x => x.BudgetCycleId,
                        principalTable: "budget_cycle",
                        principalColumn: "Id",
                        onDelete: ReferentialAction.Restrict);
                    table.ForeignKey(
                        name: "FK_approval_packet_marr_policy_version_MarrPolicyVersionId",
                        column: x => x.MarrPolicyVersionId,
                        principalTable: "marr_policy_version",
                        principalColumn: "Id",
                        onDelete: ReferentialAction.Restrict);
                    table.ForeignKey(
                        name: "FK_approval_packet_proposal_ProposalId",
                        column: x => x.ProposalId,
                        principalTable: "proposal",
                        principalColumn: "Id",
                        onDelete: ReferentialAction.Restrict);
                });

            migrationBuilder.CreateIndex(
                name: "IX_approval_packet_BudgetCycleId",
                table: "approval_packet",
                column: "BudgetCycleId");

            migrationBuilder.CreateIndex(
                name: "IX_approval_packet_Kind_BudgetCycleId_ProposalId",
                table: "approval_packet",
                columns: new[] { "Kind", "BudgetCycleId", "ProposalId" },
                unique: true);

            migrationBuilder.CreateIndex(
                name: "IX_approval_packet_MarrPolicyVersionId",
                table: "approval_packet",
                column: "MarrPolicyVersionId");

            migrationBuilder.CreateIndex(
                name: "IX_approval_packet_ProposalId",
                table: "approval_packet",
                column: "ProposalId");
        }

        /// <inheritdoc />
        protected override void Down(MigrationBuilder migrationBuilder)
        {
            migrationBuilder.DropTable(
                name: "approval_packet");
        }
    }
}
