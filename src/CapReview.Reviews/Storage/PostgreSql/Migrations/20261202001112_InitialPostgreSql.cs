using System;
using System.Collections.Generic;
using Microsoft.EntityFrameworkCore.Migrations;
using Npgsql.EntityFrameworkCore.PostgreSQL.Metadata;

#nullable disable

namespace CapReview.Reviews.Storage.PostgreSql.Migrations
{
    /// <inheritdoc />
    public partial class InitialPostgreSql : Migration
    {
        /// <inheritdoc />
        protected override void Up(MigrationBuilder migrationBuilder)
        {
            migrationBuilder.CreateTable(
                name: "audit_event",
                columns: table => new
                {
                    Id = table.Column<long>(type: "bigint", nullable: false)
                        .Annotation("Npgsql:ValueGenerationStrategy", NpgsqlValueGenerationStrategy.IdentityByDefaultColumn),
                    At = table.Column<DateTimeOffset>(type: "timestamp with time zone", nullable: false),
                    UserId = table.Column<string>(type: "character varying(100)", maxLength: 100, nullable: false),
                    Action = table.Column<string>(type: "character varying(60)", maxLength: 60, nullable: false),
                    EntityType = table.Column<string>(type: "character varying(60)", maxLength: 60, nullable: false),
                    EntityId = table.Column<string>(type: "character varying(60)", maxLength: 60, nullable: false),
                    Before = table.Column<string>(type: "text", nullable: true),
                    After = table.Column<string>(type: "text", nullable: true),
                    PreviousHash = table.Column<string>(type: "character varying(64)", maxLength: 64, nullable: false),
                    Hash = table.Column<string>(type: "character varying(64)", maxLength: 64, nullable: false)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_audit_event", x => x.Id);
                });

            migrationBuilder.CreateTable(
                name: "marr_policy_version",
                columns: table => new
                {
                    Id = table.Column<int>(type: "integer", nullable: false)
                        .Annotation("Npgsql:ValueGenerationStrategy", NpgsqlValueGenerationStrategy.IdentityByDefaultColumn),
                    Number = table.Column<int>(type: "integer", nullable: false),
                    Rate = table.Column<double>(type: "double precision", nullable: false),
                    Basis = table.Column<string>(type: "character varying(20)", maxLength: 20, nullable: false),
                    CompoundingsPerYear = table.Column<int>(type: "integer", nullable: false),
                    EffectiveFrom = table.Column<DateOnly>(type: "date", nullable: false),
                    LowRiskPremium = table.Column<double>(type: "double precision", nullable: false),
                    StandardRiskPremium = table.Column<double>(type: "double precision", nullable: false),
                    HighRiskPremium = table.Column<double>(type: "double precision", nullable: false),
                    InflationRate = table.Column<double>(type: "double precision", nullable: false),
                    RealMarr = table.Column<bool>(type: "boolean", nullable: false),
                    AfterTaxRate = table.Column<double>(type: "double precision", nullable: true),
                    SetBy = table.Column<string>(type: "character varying(100)", maxLength: 100, nullable: false),
                    Reason = table.Column<string>(type: "character varying(1000)", maxLength: 1000, nullable: false),
                    CreatedAt = table.Column<DateTimeOffset>(type: "timestamp with time zone", nullable: false)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_marr_policy_version", x => x.Id);
                });

            migrationBuilder.CreateTable(
                name: "organisation",
                columns: table => new
                {
                    Id = table.Column<int>(type: "integer", nullable: false),
                    Name = table.Column<string>(type: "character varying(200)", maxLength: 200, nullable: false),
                    CurrencyCode = table.Column<string>(type: "character varying(3)", maxLength: 3, nullable: false),
                    CultureName = table.Column<string>(type: "character varying(20)", maxLength: 20, nullable: false)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_organisation", x => x.Id);
                });

            migrationBuilder.CreateTable(
                name: "user_preference",
                columns: table => new
                {
                    Id = table.Column<int>(type: "integer", nullable: false)
                        .Annotation("Npgsql:ValueGenerationStrategy", NpgsqlValueGenerationStrategy.IdentityByDefaultColumn),
                    UserId = table.Column<string>(type: "character varying(100)", maxLength: 100, nullable: false),
                    Name = table.Column<string>(type: "character varying(60)", maxLength: 60, nullable: false),
                    Value = table.Column<string>(type: "character varying(2000)", maxLength: 2000, nullable: false),
                    UpdatedAt = table.Column<DateTimeOffset>(type: "timestamp with time zone", nullable: false)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_user_preference", x => x.Id);
                });

            migrationBuilder.CreateTable(
                name: "budget_cycle",
                columns: table => new
                {
                    Id = table.Column<int>(type: "integer", nullable: false)
                        .Annotation("Npgsql:ValueGenerationStrategy", NpgsqlValueGenerationStrategy.IdentityByDefaultColumn),
                    Name = table.Column<string>(type: "character varying(200)", maxLength: 200, nullable: false),
                    CapitalLimit = table.Column<decimal>(type: "numeric(18,2)", precision: 18, scale: 2, nullable: false),
                    MarrPolicyVersionId = table.Column<int>(type: "integer", nullable: false),
                    OpensOn = table.Column<DateOnly>(type: "date", nullable: false),
                    ClosesOn = table.Column<DateOnly>(type: "date", nullable: false),
                    Status = table.Column<string>(type: "character varying(20)", maxLength: 20, nullable: false),
                    RequiredSignOffs = table.Column<int>(type: "integer", nullable: false),
                    StudyPeriodYears = table.Column<int>(type: "integer", nullable: true),
                    LaterYearLimits = table.Column<List<decimal>>(type: "numeric[]", nullable: false),
                    Objective = table.Column<string>(type: "character varying(20)", maxLength: 20, nullable: false),
                    Revision = table.Column<int>(type: "integer", nullable: false)
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
                name: "exclusive_group",
                columns: table => new
                {
                    Id = table.Column<int>(type: "integer", nullable: false)
                        .Annotation("Npgsql:ValueGenerationStrategy", NpgsqlValueGenerationStrategy.IdentityByDefaultColumn),
                    BudgetCycleId = table.Column<int>(type: "integer", nullable: false),
                    Name = table.Column<string>(type: "character varying(100)", maxLength: 100, nullable: false),
                    Mandatory = table.Column<bool>(type: "boolean", nullable: false),
                    ProposalIds = table.Column<List<int>>(type: "integer[]", nullable: false)
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

            migrationBuilder.CreateTable(
                name: "proposal",
                columns: table => new
                {
                    Id = table.Column<int>(type: "integer", nullable: false)
                        .Annotation("Npgsql:ValueGenerationStrategy", NpgsqlValueGenerationStrategy.IdentityByDefaultColumn),
                    Reference = table.Column<string>(type: "character varying(20)", maxLength: 20, nullable: false),
                    OwnerId = table.Column<string>(type: "character varying(100)", maxLength: 100, nullable: false),
                    Title = table.Column<string>(type: "character varying(200)", maxLength: 200, nullable: false),
                    Description = table.Column<string>(type: "character varying(4000)", maxLength: 4000, nullable: false),
                    Category = table.Column<string>(type: "character varying(20)", maxLength: 20, nullable: false),
                    RiskClass = table.Column<string>(type: "character varying(20)", maxLength: 20, nullable: false),
                    Status = table.Column<string>(type: "character varying(20)", maxLength: 20, nullable: false),
                    BudgetCycleId = table.Column<int>(type: "integer", nullable: true),
                    Revision = table.Column<int>(type: "integer", nullable: false)
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
                name: "sign_off",
                columns: table => new
                {
                    Id = table.Column<int>(type: "integer", nullable: false)
                        .Annotation("Npgsql:ValueGenerationStrategy", NpgsqlValueGenerationStrategy.IdentityByDefaultColumn),
                    BudgetCycleId = table.Column<int>(type: "integer", nullable: false),
                    UserId = table.Column<string>(type: "character varying(100)", maxLength: 100, nullable: false),
                    DisplayName = table.Column<string>(type: "character varying(200)", maxLength: 200, nullable: false),
                    SignedAt = table.Column<DateTimeOffset>(type: "timestamp with time zone", nullable: false),
                    DecisionsSigned = table.Column<string>(type: "text", nullable: false)
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

            migrationBuilder.CreateTable(
                name: "approval_packet",
                columns: table => new
                {
                    Id = table.Column<int>(type: "integer", nullable: false)
                        .Annotation("Npgsql:ValueGenerationStrategy", NpgsqlValueGenerationStrategy.IdentityByDefaultColumn),
                    Kind = table.Column<string>(type: "character varying(20)", maxLength: 20, nullable: false),
                    BudgetCycleId = table.Column<int>(type: "integer", nullable: false),
                    ProposalId = table.Column<int>(type: "integer", nullable: true),
                    VersionNumber = table.Column<int>(type: "integer", nullable: true),
                    AssumptionsHash = table.Column<string>(type: "character varying(64)", maxLength: 64, nullable: true),
                    MarrPolicyVersionId = table.Column<int>(type: "integer", nullable: false),
                    FileName = table.Column<string>(type: "character varying(200)", maxLength: 200, nullable: false),
                    FileSha256 = table.Column<string>(type: "character varying(64)", maxLength: 64, nullable: false),
                    Content = table.Column<byte[]>(type: "bytea", nullable: false),
                    CreatedAt = table.Column<DateTimeOffset>(type: "timestamp with time zone", nullable: false),
                    CertificateSubject = table.Column<string>(type: "character varying(400)", maxLength: 400, nullable: false),
                    CertificateThumbprint = table.Column<string>(type: "character varying(64)", maxLength: 64, nullable: false),
                    DevelopmentCertificate = table.Column<bool>(type: "boolean", nullable: false)
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

            migrationBuilder.CreateTable(
                name: "contingency",
                columns: table => new
                {
                    Id = table.Column<int>(type: "integer", nullable: false)
                        .Annotation("Npgsql:ValueGenerationStrategy", NpgsqlValueGenerationStrategy.IdentityByDefaultColumn),
                    BudgetCycleId = table.Column<int>(type: "integer", nullable: false),
                    DependentProposalId = table.Column<int>(type: "integer", nullable: false),
                    PrerequisiteProposalId = table.Column<int>(type: "integer", nullable: false)
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
                name: "decision",
                columns: table => new
                {
                    Id = table.Column<int>(type: "integer", nullable: false)
                        .Annotation("Npgsql:ValueGenerationStrategy", NpgsqlValueGenerationStrategy.IdentityByDefaultColumn),
                    ProposalId = table.Column<int>(type: "integer", nullable: false),
                    BudgetCycleId = table.Column<int>(type: "integer", nullable: false),
                    VersionNumber = table.Column<int>(type: "integer", nullable: false),
                    AssumptionsHash = table.Column<string>(type: "character varying(64)", maxLength: 64, nullable: false),
                    MarrPolicyVersionId = table.Column<int>(type: "integer", nullable: false),
                    Outcome = table.Column<string>(type: "character varying(20)", maxLength: 20, nullable: false),
                    Conditions = table.Column<string>(type: "character varying(2000)", maxLength: 2000, nullable: false),
                    DecidedBy = table.Column<string>(type: "character varying(100)", maxLength: 100, nullable: false),
                    DecidedAt = table.Column<DateTimeOffset>(type: "timestamp with time zone", nullable: false)
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
                name: "proposal_comment",
                columns: table => new
                {
                    Id = table.Column<int>(type: "integer", nullable: false)
                        .Annotation("Npgsql:ValueGenerationStrategy", NpgsqlValueGenerationStrategy.IdentityByDefaultColumn),
                    ProposalId = table.Column<int>(type: "integer", nullable: false),
                    VersionNumber = table.Column<int>(type: "integer", nullable: false),
                    AuthorId = table.Column<string>(type: "character varying(100)", maxLength: 100, nullable: false),
                    AuthorName = table.Column<string>(type: "character varying(200)", maxLength: 200, nullable: false),
                    At = table.Column<DateTimeOffset>(type: "timestamp with time zone", nullable: false),
                    Text = table.Column<string>(type: "character varying(2000)", maxLength: 2000, nullable: false)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_proposal_comment", x => x.Id);
                    table.ForeignKey(
                        name: "FK_proposal_comment_proposal_ProposalId",
                        column: x => x.ProposalId,
                        principalTable: "proposal",
                        principalColumn: "Id",
                        onDelete: ReferentialAction.Restrict);
                });

            migrationBuilder.CreateTable(
                name: "proposal_version",
                columns: table => new
                {
                    Id = table.Column<int>(type: "integer", nullable: false)
                        .Annotation("Npgsql:ValueGenerationStrategy", NpgsqlValueGenerationStrategy.IdentityByDefaultColumn),
                    ProposalId = table.Column<int>(type: "integer", nullable: false),
                    Number = table.Column<int>(type: "integer", nullable: false),
                    AuthorId = table.Column<string>(type: "character varying(100)", maxLength: 100, nullable: false),
                    CreatedAt = table.Column<DateTimeOffset>(type: "timestamp with time zone", nullable: false),
                    Reason = table.Column<string>(type: "character varying(1000)", maxLength: 1000, nullable: false),
                    IsFrozen = table.Column<bool>(type: "boolean", nullable: false),
                    FrozenAt = table.Column<DateTimeOffset>(type: "timestamp with time zone", nullable: true),
                    AssumptionsJson = table.Column<string>(type: "text", nullable: false),
                    AssumptionsHash = table.Column<string>(type: "character varying(64)", maxLength: 64, nullable: false),
                    Revision = table.Column<int>(type: "integer", nullable: false)
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
                name: "IX_contingency_BudgetCycleId_DependentProposalId_PrerequisiteP~",
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
                name: "IX_decision_BudgetCycleId",
                table: "decision",
                column: "BudgetCycleId");

            migrationBuilder.CreateIndex(
                name: "IX_decision_ProposalId",
                table: "decision",
                column: "ProposalId");

            migrationBuilder.CreateIndex(
                name: "IX_exclusive_group_BudgetCycleId_Name",
                table: "exclusive_group",
                columns: new[] { "BudgetCycleId", "Name" },
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
                name: "IX_proposal_comment_ProposalId",
                table: "proposal_comment",
                column: "ProposalId");

            migrationBuilder.CreateIndex(
                name: "IX_proposal_version_ProposalId_Number",
                table: "proposal_version",
                columns: new[] { "ProposalId", "Number" },
                unique: true);

            migrationBuilder.CreateIndex(
                name: "IX_sign_off_BudgetCycleId_UserId",
                table: "sign_off",
                columns: new[] { "BudgetCycleId", "UserId" },
                unique: true);

            migrationBuilder.CreateIndex(
                name: "IX_user_preference_UserId_Name",
                table: "user_preference",
                columns: new[] { "UserId", "Name" },
                unique: true);
        }

        /// <inheritdoc />
        protected override void Down(MigrationBuilder migrationBuilder)
        {
            migrationBuilder.DropTable(
                name: "approval_packet");

            migrationBuilder.DropTable(
                name: "audit_event");

            migrationBuilder.DropTable(
                name: "contingency");

            migrationBuilder.DropTable(
                name: "decision");

            migrationBuilder.DropTable(
                name: "exclusive_group");

            migrationBuilder.DropTable(
                name: "organisation");

            migrationBuilder.DropTable(
                name: "proposal_comment");

            migrationBuilder.DropTable(
                name: "proposal_version");

            migrationBuilder.DropTable(
                name: "sign_off");

            migrationBuilder.DropTable(
                name: "user_preference");

            migrationBuilder.DropTable(
                name: "proposal");

            migrationBuilder.DropTable(
                name: "budget_cycle");

            migrationBuilder.DropTable(
                name: "marr_policy_version");
        }
    }
}
