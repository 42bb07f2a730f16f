using CapReview.Reviews.Audit;
using CapReview.Reviews.Comments;
using CapReview.Reviews.Common;
using CapReview.Reviews.Cycles;
using CapReview.Reviews.Decisions;
using CapReview.Reviews.Marr;
using CapReview.Reviews.Organisation;
using CapReview.Reviews.Portfolio;
using CapReview.Reviews.Proposals;
using CapReview.Reviews.Storage;
using Microsoft.EntityFrameworkCore;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.DependencyInjection.Extensions;

namespace CapReview.Reviews;

/// <summary>Registers the domain services and the database (SQLite, or PostgreSQL).</summary>
public static class ReviewsServiceCollectionExtensions
{
    public static IServiceCollection AddReviews(this IServiceCollection services, string sqliteConnectionString) =>
        services.AddReviews(DatabaseSettings.Sqlite(sqliteConnectionString));

    /// <summary>
    /// The domain on <paramref name="database"/>. The audit chain is keyed with <paramref name="auditKeys"/>, which an
    /// installation keeps outside the database; without them a key that dies with the process (tests only).
    /// </summary>
    public static IServiceCollection AddReviews(this IServiceCollection services, DatabaseSettings database, AuditKeyRing? auditKeys = null, string? auditHeadLog = null)
    {
        ArgumentNullException.ThrowIfNull(database);
        services.AddSingleton(auditKeys ?? AuditKeyRing.Ephemeral());
        services.AddSingleton(new AuditHeadLog(auditHeadLog));
        services.TryAddSingleton(Interchange.TrustedSigners.None);
        if (database.Provider == DatabaseProvider.PostgreSql)
        {
            services.AddDbContextFactory<Storage.PostgreSql.PostgreSqlReviewsDbContext>(options => database.Apply(options));
            services.AddSingleton<IDbContextFactory<CapReviewDbContext>, DerivedContextFactory<CapReviewDbContext, Storage.PostgreSql.PostgreSqlReviewsDbContext>>();
        }
        else
        {
            services.AddDbContextFactory<CapReviewDbContext>(options => database.Apply(options));
        }
        services.AddSingleton<DatabaseInitializer>();
        services.AddSingleton<OrganisationQueries>();
        services.AddSingleton<TimeProvider, StorageClock>();
        services.AddSingleton<ReviewWork>();
        services.AddSingleton<AuditTrail>();
        services.AddSingleton<AuditQueries>();
        services.AddSingleton<AuditSearch>();
        services.AddSingleton<ProposalService>();
        services.AddSingleton<MarrPolicyService>();
        services.AddSingleton<CycleService>();
        services.AddSingleton<CycleOverviewService>();
        services.AddSingleton<DecisionService>();
        services.AddSingleton<PortfolioApprovalService>();
        services.AddSingleton<CommentService>();
        services.AddSingleton<PortfolioRulesService>();
        services.AddSingleton<CycleRankingService>();
        services.AddSingleton<PortfolioService>();
        services.TryAddSingleton(new Runs.RunLimitOptions());
        services.AddSingleton<Runs.RunLimiter>();
        services.AddSingleton<Risk.RiskRuns>();
        services.AddSingleton<IncrementalAnalysisService>();
        services.AddSingleton<ReplacementService>();
        services.AddSingleton<Records.PacketArchive>();
        services.AddSingleton<Records.DecisionRecords>();
        services.AddSingleton<Records.PacketJobSignal>();
        services.AddSingleton<Records.PacketJobs>();
        services.AddSingleton<Interchange.CycleExporter>();
        services.AddSingleton<Interchange.CycleImporter>();
        services.AddSingleton<Preferences.PreferenceService>();
        return services;
    }
}
