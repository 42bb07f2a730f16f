using CapReview.Reviews.Audit;
using CapReview.Reviews.Comments;
using CapReview.Reviews.Cycles;
using CapReview.Reviews.Decisions;
using CapReview.Reviews.Marr;
using CapReview.Reviews.Organisation;
using CapReview.Reviews.Portfolio;
using CapReview.Reviews.Proposals;
using CapReview.Reviews.Records;
using Microsoft.EntityFrameworkCore;

namespace CapReview.Reviews.Storage;

/// <summary>
/// The installation's database. Create one per operation through IDbContextFactory. Rows written once (frozen
/// proposal versions, decisions, sign-offs, comments, MARR policy versions, approval packets, audit events) are guarded
/// twice: <see cref="WriteOnceRowsInterceptor"/> refuses a save that changes them, database triggers refuse everything else.
/// </summary>
public class CapReviewDbContext : DbContext
{
    public CapReviewDbContext(DbContextOptions<CapReviewDbContext> options)
        : base(options)
    {
    }

    /// <summary>For a provider's own context type (<see cref="PostgreSql.PostgreSqlReviewsDbContext"/>), which carries its own migrations.</summary>
    protected CapReviewDbContext(DbContextOptions options)
        : base(options)
    {
    }

    public DbSet<OrganisationProfile> Organisations => Set<OrganisationProfile>();

    public DbSet<Proposal> Proposals => Set<Proposal>();

    public DbSet<ProposalVersion> ProposalVersions => Set<ProposalVersion>();

    public DbSet<MarrPolicyVersion> MarrPolicyVersions => Set<MarrPolicyVersion>();

    public DbSet<MarrVersionRetirement> MarrVersionRetirements => Set<MarrVersionRetirement>();

    public DbSet<BudgetCycle> BudgetCycles => Set<BudgetCycle>();

    public DbSet<AuditEvent> AuditEvents => Set<AuditEvent>();

    public DbSet<Decision> Decisions => Set<Decision>();

    public DbSet<SignOff> SignOffs => Set<SignOff>();

    public DbSet<ProposalComment> Comments => Set<ProposalComment>();

    public DbSet<ExclusiveGroup> ExclusiveGroups => Set<ExclusiveGroup>();

    public DbSet<Contingency> Contingencies => Set<Contingency>();

    public DbSet<ApprovalPacket> ApprovalPackets => Set<ApprovalPacket>();

    public DbSet<PacketJob> PacketJobs => Set<PacketJob>();

    public DbSet<Interchange.CycleImport> CycleImports => Set<Interchange.CycleImport>();

    public DbSet<Preferences.UserPreference> UserPreferences => Set<Preferences.UserPreference>();

    protected override void OnConfiguring(DbContextOptionsBuilder optionsBuilder)
    {
        ArgumentNullException.ThrowIfNull(optionsBuilder);
        // Here rather than at each registration, so that every context refuses alike: both providers, the design-time
        // factories and any context a test builds from bare options.
        optionsBuilder.AddInterceptors(WriteOnceRowsInterceptor.Instance, StorableTextInterceptor.Instance);
    }

    protected override void OnModelCreating(ModelBuilder modelBuilder)
    {
        ArgumentNullException.ThrowIfNull(modelBuilder);
        modelBuilder.Entity<OrganisationProfile>(profile =>
        {
            profile.ToTable("organisation");
            profile.Property(p => p.Id).ValueGeneratedNever();
            profile.Property(p => p.Name).HasMaxLength(200);
            profile.Property(p => p.CurrencyCode).HasMaxLength(3);
            profile.Property(p => p.CultureName).HasMaxLength(20);
        });

        modelBuilder.Entity<Proposal>(p =>
        {
            p.ToTable("proposal");
            p.Property(x => x.Reference).HasMaxLength(20);
            p.HasIndex(x => x.Reference).IsUnique();
            p.Property(x => x.OwnerId).HasMaxLength(100);
            p.HasIndex(x => x.OwnerId);
            p.Property(x => x.Title).HasMaxLength(200);
            p.Property(x => x.Description).HasMaxLength(4000);
            p.Property(x => x.Category).HasConversion<string>().HasMaxLength(20);
            p.Property(x => x.RiskClass).HasConversion<string>().HasMaxLength(20);
            p.Property(x => x.Status).HasConversion<string>().HasMaxLength(20);
            p.Property(x => x.Revision).IsConcurrencyToken();
            p.HasMany(x => x.Versions).WithOne().HasForeignKey(v => v.ProposalId).OnDelete(DeleteBehavior.Restrict);
            p.HasOne<BudgetCycle>().WithMany().HasForeignKey(x => x.BudgetCycleId).OnDelete(DeleteBehavior.Restrict);
        });

        modelBuilder.Entity<ProposalVersion>(v =>
        {
            v.ToTable("proposal_version");
            v.HasIndex(x => new { x.ProposalId, x.Number }).IsUnique();
            v.Property(x => x.AuthorId).HasMaxLength(100);
            v.Property(x => x.Reason).HasMaxLength(1000);
            v.Property(x => x.AssumptionsHash).HasMaxLength(64);
            v.Property(x => x.Revision).IsConcurrencyToken();
        });

        modelBuilder.Entity<MarrPolicyVersion>(m =>
        {
            m.ToTable("marr_policy_version");
            m.HasIndex(x => x.Number).IsUnique();
            m.Property(x => x.Basis).HasConversion<string>().HasMaxLength(20);
            m.Property(x => x.SetBy).HasMaxLength(100);
            m.Property(x => x.Reason).HasMaxLength(1000);
        });

        modelBuilder.Entity<MarrVersionRetirement>(r =>
        {
            r.ToTable("marr_version_retirement");
            r.HasIndex(x => x.MarrPolicyVersionId).IsUnique();
            r.Property(x => x.Reason).HasMaxLength(1000);
            r.Property(x => x.RetiredBy).HasMaxLength(100);
            r.HasOne<MarrPolicyVersion>().WithMany().HasForeignKey(x => x.MarrPolicyVersionId).OnDelete(DeleteBehavior.Restrict);
        });

        modelBuilder.Entity<BudgetCycle>(c =>
        {
            c.ToTable("budget_cycle");
            c.Property(x => x.Name).HasMaxLength(200);
            c.HasIndex(x => x.Name).IsUnique();
            c.Property(x => x.CapitalLimit).HasPrecision(18, 2);
            c.Property(x => x.Status).HasConversion<string>().HasMaxLength(20);
            c.Property(x => x.Objective).HasConversion<string>().HasMaxLength(20);
            c.PrimitiveCollection(x => x.LaterYearLimits);
            c.Property(x => x.Revision).IsConcurrencyToken();
            c.HasOne<MarrPolicyVersion>().WithMany().HasForeignKey(x => x.MarrPolicyVersionId).OnDelete(DeleteBehavior.Restrict);
        });

        modelBuilder.Entity<Decision>(d =>
        {
            d.ToTable("decision");
            d.HasIndex(x => x.ProposalId);
            d.Property(x => x.AssumptionsHash).HasMaxLength(64);
            d.Property(x => x.Outcome).HasConversion<string>().HasMaxLength(20);
            d.Property(x => x.Conditions).HasMaxLength(2000);
            d.Property(x => x.DecidedBy).HasMaxLength(100);
            d.Property(x => x.OverriddenRules).HasMaxLength(4000).HasDefaultValue("");
            d.Property(x => x.OverrideReason).HasMaxLength(2000).HasDefaultValue("");
            d.HasOne<Proposal>().WithMany().HasForeignKey(x => x.ProposalId).OnDelete(DeleteBehavior.Restrict);
            d.HasOne<BudgetCycle>().WithMany().HasForeignKey(x => x.BudgetCycleId).OnDelete(DeleteBehavior.Restrict);
        });

        modelBuilder.Entity<SignOff>(s =>
        {
            s.ToTable("sign_off");
            // One member may sign again once a later submission or decision supersedes their sign-off (CycleSignOffs).
            s.HasIndex(x => new { x.BudgetCycleId, x.UserId });
            s.Property(x => x.UserId).HasMaxLength(100);
            s.Property(x => x.DisplayName).HasMaxLength(200);
            s.HasOne<BudgetCycle>().WithMany().HasForeignKey(x => x.BudgetCycleId).OnDelete(DeleteBehavior.Restrict);
        });

        modelBuilder.Entity<Interchange.CycleImport>(i =>
        {
            i.ToTable("cycle_import");
            i.HasIndex(x => x.BudgetCycleId).IsUnique();
            i.Property(x => x.DocumentSha256).HasMaxLength(64);
            i.Property(x => x.Installation).HasMaxLength(200);
            i.Property(x => x.ImportedBy).HasMaxLength(100);
            i.Property(x => x.ImportedByName).HasMaxLength(200);
            i.Property(x => x.Signature).HasMaxLength(400);
            i.HasOne<BudgetCycle>().WithMany().HasForeignKey(x => x.BudgetCycleId).OnDelete(DeleteBehavior.Restrict);
        });

        modelBuilder.Entity<ProposalComment>(c =>
        {
            c.ToTable("proposal_comment");
            c.HasIndex(x => x.ProposalId);
            c.Property(x => x.AuthorId).HasMaxLength(100);
            c.Property(x => x.AuthorName).HasMaxLength(200);
            c.Property(x => x.Text).HasMaxLength(CommentService.MaxLength);
            c.HasOne<Proposal>().WithMany().HasForeignKey(x => x.ProposalId).OnDelete(DeleteBehavior.Restrict);
        });

        modelBuilder.Entity<ExclusiveGroup>(g =>
        {
            g.ToTable("exclusive_group");
            g.Property(x => x.Name).HasMaxLength(100);
            g.HasIndex(x => new { x.BudgetCycleId, x.Name }).IsUnique();
            g.PrimitiveCollection(x => x.ProposalIds);
            g.HasOne<BudgetCycle>().WithMany().HasForeignKey(x => x.BudgetCycleId).OnDelete(DeleteBehavior.Restrict);
        });

        modelBuilder.Entity<Contingency>(c =>
        {
            c.ToTable("contingency");
            c.HasIndex(x => new { x.BudgetCycleId, x.DependentProposalId, x.PrerequisiteProposalId }).IsUnique();
            c.HasOne<BudgetCycle>().WithMany().HasForeignKey(x => x.BudgetCycleId).OnDelete(DeleteBehavior.Restrict);
            c.HasOne<Proposal>().WithMany().HasForeignKey(x => x.DependentProposalId).OnDelete(DeleteBehavior.Restrict);
            c.HasOne<Proposal>().WithMany().HasForeignKey(x => x.PrerequisiteProposalId).OnDelete(DeleteBehavior.Restrict);
        });

        modelBuilder.Entity<ApprovalPacket>(p =>
        {
            p.ToTable("approval_packet");
            p.Property(x => x.Kind).HasConversion<string>().HasMaxLength(20);
            p.Property(x => x.AssumptionsHash).HasMaxLength(64);
            p.Property(x => x.FileName).HasMaxLength(200);
            p.Property(x => x.AuditHeadHash).HasMaxLength(64);
            p.Property(x => x.FileSha256).HasMaxLength(64);
            p.Property(x => x.CertificateSubject).HasMaxLength(400);
            p.Property(x => x.CertificateThumbprint).HasMaxLength(64);
            // One packet per cycle and per decided proposal; a second attempt finds the first.
            p.HasIndex(x => new { x.Kind, x.BudgetCycleId, x.ProposalId }).IsUnique();
            p.HasOne<BudgetCycle>().WithMany().HasForeignKey(x => x.BudgetCycleId).OnDelete(DeleteBehavior.Restrict);
            p.HasOne<Proposal>().WithMany().HasForeignKey(x => x.ProposalId).OnDelete(DeleteBehavior.Restrict);
            p.HasOne<MarrPolicyVersion>().WithMany().HasForeignKey(x => x.MarrPolicyVersionId).OnDelete(DeleteBehavior.Restrict);
        });

        modelBuilder.Entity<PacketJob>(j =>
        {
            j.ToTable("packet_job");
            // One job per cycle: asking again queues the same row.
            j.HasIndex(x => x.BudgetCycleId).IsUnique();
            j.Property(x => x.Status).HasConversion<string>().HasMaxLength(20);
            j.Property(x => x.RequestedBy).HasMaxLength(100);
            j.Property(x => x.RequestedByName).HasMaxLength(200);
            j.Property(x => x.LastError).HasMaxLength(500);
            j.HasOne<BudgetCycle>().WithMany().HasForeignKey(x => x.BudgetCycleId).OnDelete(DeleteBehavior.Restrict);
        });

        modelBuilder.Entity<Preferences.UserPreference>(p =>
        {
            p.ToTable("user_preference");
            p.Property(x => x.UserId).HasMaxLength(100);
            p.Property(x => x.Name).HasMaxLength(Preferences.PreferenceService.MaxNameLength);
            p.Property(x => x.Value).HasMaxLength(Preferences.PreferenceService.MaxValueLength);
            p.HasIndex(x => new { x.UserId, x.Name }).IsUnique();
        });

        modelBuilder.Entity<AuditEvent>(a =>
        {
            a.ToTable("audit_event");
            a.Property(x => x.UserId).HasMaxLength(100);
            a.Property(x => x.Action).HasMaxLength(60);
            a.Property(x => x.EntityType).HasMaxLength(60);
            a.Property(x => x.EntityId).HasMaxLength(60);
            a.Property(x => x.PreviousHash).HasMaxLength(64);
            a.Property(x => x.Hash).HasMaxLength(64);
            a.Property(x => x.KeyId).HasMaxLength(40);
            // Two events can never share a predecessor: a forked chain fails to save.
            a.HasIndex(x => x.PreviousHash).IsUnique();
        });
    }
}
