using Microsoft.EntityFrameworkCore.Migrations;

#nullable disable

namespace CapReview.Reviews.Storage.Migrations
{
    /// <inheritdoc />
    public partial class SupersededSignOffs : Migration
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
        }

        /// <inheritdoc />
        protected override void Down(MigrationBuilder migrationBuilder)
        {
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
