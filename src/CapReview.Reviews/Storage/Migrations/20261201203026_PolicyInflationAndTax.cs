using Microsoft.EntityFrameworkCore.Migrations;

#nullable disable

namespace CapReview.Reviews.Storage.Migrations
{
    /// <inheritdoc />
    public partial class PolicyInflationAndTax : Migration
    {
        /// <inheritdoc />
        protected override void Up(MigrationBuilder migrationBuilder)
        {
            migrationBuilder.AddColumn<double>(
                name: "AfterTaxRate",
                table: "marr_policy_version",
                type: "REAL",
                nullable: true);

            migrationBuilder.AddColumn<double>(
                name: "InflationRate",
                table: "marr_policy_version",
                type: "REAL",
                nullable: false,
                defaultValue: 0.0);

            migrationBuilder.AddColumn<bool>(
                name: "RealMarr",
                table: "marr_policy_version",
                type: "INTEGER",
                nullable: false,
                defaultValue: false);
        }

        /// <inheritdoc />
        protected override void Down(MigrationBuilder migrationBuilder)
        {
            migrationBuilder.DropColumn(
                name: "AfterTaxRate",
                table: "marr_policy_version");

            migrationBuilder.DropColumn(
                name: "InflationRate",
                table: "marr_policy_version");

            migrationBuilder.DropColumn(
                name: "RealMarr",
                table: "marr_policy_version");
        }
    }
}
