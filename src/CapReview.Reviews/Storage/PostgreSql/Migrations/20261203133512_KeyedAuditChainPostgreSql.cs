using Microsoft.EntityFrameworkCore.Migrations;

#nullable disable

namespace CapReview.Reviews.Storage.PostgreSql.Migrations
{
    /// <inheritdoc />
    public partial class KeyedAuditChainPostgreSql : Migration
    {
        /// <inheritdoc />
        protected override void Up(MigrationBuilder migrationBuilder)
        {
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
        }

        /// <inheritdoc />
        protected override void Down(MigrationBuilder migrationBuilder)
        {
            migrationBuilder.DropColumn(
                name: "KeyId",
                table: "audit_event");

            migrationBuilder.DropColumn(
                name: "AuditEventCount",
                table: "approval_packet");

            migrationBuilder.DropColumn(
                name: "AuditHeadHash",
                table: "approval_packet");
        }
    }
}
