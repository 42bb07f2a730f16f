using System.Text.Json.Nodes;
using CapReview.Reviews.Access;
using CapReview.Reviews.Cycles;
using CapReview.Reviews.Interchange;
using CapReview.Web.Demo;
using CapReview.Web.Identity;
using CapReview.Web.Tests.Api;
using Microsoft.EntityFrameworkCore;
using Microsoft.Extensions.DependencyInjection;

namespace CapReview.Web.Tests.Exports;

/// <summary>Two installations: the demo's, exported cycle by cycle, and an empty one that imports them.</summary>
public sealed class CycleDocumentTests : IAsyncLifetime
{
    private readonly ApiFactory _source = new();
    private readonly ApiFactory _target = new();
    private static readonly Actor Admin = Actor.Of("document-admin", "Document Admin", Role.Administrator);

    public async Task InitializeAsync()
    {
        using var scope = _source.Services.CreateScope();
        await scope.ServiceProvider.GetRequiredService<DemoScenario>().EnsureAsync(CancellationToken.None);
        _target.CreateClient().Dispose();
    }

    public async Task DisposeAsync()
    {
        await _source.DisposeAsync();
        await _target.DisposeAsync();
    }

    private async Task<byte[]> ExportAsync(ApiFactory installation, string cycleName)
    {
        var cycles = await installation.Services.GetRequiredService<CycleService>().ListAsync(CancellationToken.None);
        var document = await installation.Services.GetRequiredService<CycleExporter>().ExportAsync(Admin, cycles.Single(c => c.Name == cycleName).Id, CancellationToken.None);
        return CycleDocumentJson.Write(document);
    }

    /// <summary>The target gets an account for each of the source's people, as an organisation moving installations would.</summary>
    private async Task CopyPeopleAsync()
    {
        var contexts = _source.Services.GetRequiredService<IDbContextFactory<CapReviewIdentityDbContext>>();
        await using var db = await contexts.CreateDbContextAsync();
        using var scope = _target.Services.CreateScope();
        var identity = scope.ServiceProvider.GetRequiredService<IdentityStore>();
        foreach (var user in await db.Users.AsNoTracking().ToListAsync())
        {
            await identity.CreateUserAsync(user.Email!, user.DisplayName, "moved-installation-2027", [RoleNames.ProjectLead]);
        }
    }

    /// <summary>The fields a round trip may change: when it was exported and the policy's number where it was exported from.</summary>
    private static JsonNode Comparable(byte[] document)
    {
        JsonNode node = JsonNode.Parse(document)!;
        node.AsObject().Remove("exportedAt");
        node["marrPolicy"]!.AsObject().Remove("sourceNumber");
        node["marrPolicy"]!.AsObject().Remove("sourceSha256");
        return node;
    }

    [Fact]
    public async Task A_decided_and_an_open_cycle_come_back_unchanged_from_another_installation()
    {
        await CopyPeopleAsync();
        var importer = _target.Services.GetRequiredService<CycleImporter>();
        foreach (string name in (await _source.Services.GetRequiredService<CycleService>().ListAsync(CancellationToken.None)).Select(c => c.Name))
        {
            byte[] exported = await ExportAsync(_source, name);
            var result = await importer.ImportAsync(Admin, exported, CancellationToken.None);
            Assert.Empty(result.RenamedReferences);
            Assert.Empty(result.HeldByImporter);
            byte[] again = await ExportAsync(_target, name);
            Assert.Equal(Comparable(exported).ToJsonString(), Comparable(again).ToJsonString());
        }
        // The decided cycle keeps its decisions and sign-offs; the open one its groups and contingency.
        var decided = JsonNode.Parse(await ExportAsync(_target, "Capital plan 2026"))!;
        Assert.Equal("decided", decided["cycle"]!["status"]!.GetValue<string>());
        Assert.NotEmpty(decided["decisions"]!.AsArray());
        Assert.NotEmpty(decided["signOffs"]!.AsArray());
        var open = JsonNode.Parse(await ExportAsync(_target, "Capital plan 2027"))!;
        Assert.Equal(2, open["exclusiveGroups"]!.AsArray().Count);
        Assert.Single(open["contingencies"]!.AsArray());

        // A proposal started here afterwards takes the next free reference, not one an imported cycle holds.
        var lead = Actor.Of("document-new-lead", "New Lead", Role.ProjectLead);
        var draft = await _target.Services.GetRequiredService<CapReview.Reviews.Proposals.ProposalService>().CreateDraftAsync(lead,
            new("Later idea", "", CapReview.Reviews.Proposals.ProposalCategory.Other, CapReview.Reviews.Proposals.RiskClass.Standard, new() { Model = new() { Horizon = 1 } }), CancellationToken.None);
        var references = open["proposals"]!.AsArray().Select(p => p!["reference"]!.GetValue<string>())
            .Concat(decided["proposals"]!.AsArray().Select(p => p!["reference"]!.GetValue<string>())).ToList();
        Assert.DoesNotContain(draft.Reference, references);
    }

    [Fact]
    public async Task An_imported_decided_cycle_is_another_installations_record_never_acts_of_members_here_and_gets_no_packets()
    {
        // Every person of the document has an account here with the same e-mail: still, nobody here decided or signed.
        await CopyPeopleAsync();
        byte[] exported = await ExportAsync(_source, "Capital plan 2026");
        var result = await _target.Services.GetRequiredService<CycleImporter>().ImportAsync(Admin, exported, CancellationToken.None);

        var decisions = await _target.Services.GetRequiredService<CapReview.Reviews.Decisions.DecisionService>().DecisionsAsync(Admin, result.CycleId, CancellationToken.None);
        Assert.NotEmpty(decisions);
        Assert.All(decisions, d => Assert.True(d.Imported, d.DecidedBy));
        Assert.All(decisions, d => Assert.StartsWith("imported:", d.DecidedBy, StringComparison.Ordinal));
        var signOffs = await _target.Services.GetRequiredService<CapReview.Reviews.Decisions.DecisionService>().SignOffsAsync(Admin, result.CycleId, CancellationToken.None);
        Assert.Empty(signOffs.Current);
        Assert.Equal(JsonNode.Parse(exported)!["signOffs"]!.AsArray().Count, signOffs.Imported.Count);

        var import = await _target.Services.GetRequiredService<CapReview.Reviews.Records.DecisionRecords>().ImportOfAsync(result.CycleId, CancellationToken.None);
        Assert.NotNull(import);
        Assert.Equal(Convert.ToHexStringLower(System.Security.Cryptography.SHA256.HashData(exported)), import.DocumentSha256);
        Assert.Equal(JsonNode.Parse(exported)!["installation"]!.GetValue<string>(), import.Installation);
        Assert.Equal(Admin.UserId, import.ImportedBy);

        // The installation signs no packet for decisions its board did not sign off.
        var refused = await Assert.ThrowsAsync<CapReview.Reviews.Common.RuleViolationException>(() =>
            _target.Services.GetRequiredService<CapReview.Reviews.Records.PacketJobs>().RequestAsync(Admin, result.CycleId, CancellationToken.None));
        Assert.Contains("imported from another installation", refused.Message, StringComparison.Ordinal);
        await Assert.ThrowsAsync<CapReview.Reviews.Common.RuleViolationException>(() =>
            _target.Services.GetRequiredService<CapReview.Packets.PacketService>().PublishCycleAsync(Admin, result.CycleId, CancellationToken.None));
    }

    [Fact]
    public async Task A_signed_document_imports_only_from_a_trusted_signer_and_only_unchanged()
    {
        byte[] document = await ExportAsync(_source, "Capital plan 2027");
        var signing = _source.Services.GetRequiredService<CapReview.Packets.Signing.CycleDocumentSigning>();
        byte[] signature = await signing.SignAsync(document, CancellationToken.None);
        byte[] signed = SignedCycleDocument.Pack("cycle-capital-plan-2027.json", document, signature);
        string thumbprint = await signing.ThumbprintAsync(CancellationToken.None);

        // Not trusted here (yet): refused, naming the signer's thumbprint to add.
        var untrusted = await Assert.ThrowsAsync<ImportRefusedException>(() =>
            _target.Services.GetRequiredService<CycleImporter>().ImportAsync(Admin, signed, CancellationToken.None));
        Assert.Equal("signature", untrusted.Problems.Single().Field);
        Assert.Contains(thumbprint, untrusted.Problems.Single().Message, StringComparison.Ordinal);

        var trusting = ActivatorUtilities.CreateInstance<CycleImporter>(_target.Services, new TrustedSigners([thumbprint]));
        // One character of the document changed after signing, hashes left as they were: the signature no longer holds.
        byte[] edited = (byte[])document.Clone();
        int at = Array.IndexOf(edited, (byte)'2', System.Text.Encoding.UTF8.GetString(document).IndexOf("\"capitalLimit\"", StringComparison.Ordinal));
        edited[at] = (byte)'9';
        var changed = await Assert.ThrowsAsync<ImportRefusedException>(() =>
            trusting.ImportAsync(Admin, SignedCycleDocument.Pack("cycle-capital-plan-2027.json", edited, signature), CancellationToken.None));
        Assert.Contains("changed after it was signed", changed.Problems.Single().Message, StringComparison.Ordinal);

        var result = await trusting.ImportAsync(Admin, signed, CancellationToken.None);
        var import = await _target.Services.GetRequiredService<CapReview.Reviews.Records.DecisionRecords>().ImportOfAsync(result.CycleId, CancellationToken.None);
        Assert.StartsWith("signed by ", import!.Signature, StringComparison.Ordinal);
        Assert.Contains(thumbprint, import.Signature, StringComparison.Ordinal);
        Assert.Equal(Convert.ToHexStringLower(System.Security.Cryptography.SHA256.HashData(document)), import.DocumentSha256);
    }

    [Fact]
    public async Task A_decision_recorded_with_an_override_keeps_its_rules_and_reason_across_installations()
    {
        await CopyPeopleAsync();
        var importer = _target.Services.GetRequiredService<CycleImporter>();
        JsonNode document = JsonNode.Parse(await ExportAsync(_source, "Capital plan 2026"))!;
        Assert.Null(document["decisions"]![0]!["overriddenRules"]);

        JsonNode half = document.DeepClone();
        half["decisions"]![0]!["overriddenRules"] = "the capital limit of budget year 1";
        var refused = await Assert.ThrowsAsync<ImportRefusedException>(() => importer.ImportAsync(Admin, System.Text.Encoding.UTF8.GetBytes(half.ToJsonString()), CancellationToken.None));
        Assert.Equal("decisions[0].overrideReason", refused.Problems.Single().Field);

        document["decisions"]![0]!["overriddenRules"] = "the capital limit of budget year 1 (540,000 approved against a limit of 500,000)";
        document["decisions"]![0]!["overrideReason"] = "The regulator's deadline falls in this year.";
        await importer.ImportAsync(Admin, System.Text.Encoding.UTF8.GetBytes(document.ToJsonString()), CancellationToken.None);

        JsonNode again = JsonNode.Parse(await ExportAsync(_target, "Capital plan 2026"))!;
        Assert.Equal("the capital limit of budget year 1 (540,000 approved against a limit of 500,000)", again["decisions"]![0]!["overriddenRules"]!.GetValue<string>());
        Assert.Equal("The regulator's deadline falls in this year.", again["decisions"]![0]!["overrideReason"]!.GetValue<string>());
    }

    [Fact]
    public async Task A_second_import_of_the_same_cycle_or_a_changed_document_is_refused_and_changes_nothing()
    {
        var importer = _target.Services.GetRequiredService<CycleImporter>();
        byte[] exported = await ExportAsync(_source, "Capital plan 2027");
        var first = await importer.ImportAsync(Admin, exported, CancellationToken.None);
        // Nobody of the source has an account here: the importer holds the proposals until they are handed over.
        Assert.Equal(7, first.HeldByImporter.Count);
        async Task<(int Cycles, int Proposals)> CountAsync()
        {
            var db = _target.Services.GetRequiredService<IDbContextFactory<CapReview.Reviews.Storage.CapReviewDbContext>>();
            await using var context = await db.CreateDbContextAsync();
            return (await context.BudgetCycles.CountAsync(), await context.Proposals.CountAsync());
        }
        var before = await CountAsync();

        var twice = await Assert.ThrowsAsync<ImportRefusedException>(() => importer.ImportAsync(Admin, exported, CancellationToken.None));
        Assert.Equal("cycle.name", twice.Problems.Single().Field);

        JsonNode changed = JsonNode.Parse(exported)!;
        changed["cycle"]!["name"] = "Capital plan 2027 (copy)";
        changed["proposals"]![1]!["versions"]![0]!["assumptions"]!["model"]!["horizon"] = 99;
        changed["exclusiveGroups"]![0]!["members"]!.AsArray().Add("P-9999");
        changed["decisions"] = new JsonArray(new JsonObject { ["proposal"] = "P-0004", ["version"] = 7, ["outcome"] = "approve" });
        var refused = await Assert.ThrowsAsync<ImportRefusedException>(() => importer.ImportAsync(Admin, System.Text.Encoding.UTF8.GetBytes(changed.ToJsonString()), CancellationToken.None));
        Assert.Equal(["proposals[1].versions[0].assumptionsSha256", "exclusiveGroups[0].members", "decisions[0].version"], refused.Problems.Select(p => p.Field));

        JsonNode future = JsonNode.Parse(exported)!;
        future["formatVersion"] = 2;
        var version = await Assert.ThrowsAsync<ImportRefusedException>(() => importer.ImportAsync(Admin, System.Text.Encoding.UTF8.GetBytes(future.ToJsonString()), CancellationToken.None));
        Assert.Contains("reads format version 1", version.Problems.Single().Message, StringComparison.Ordinal);

        var broken = await Assert.ThrowsAsync<ImportRefusedException>(() => importer.ImportAsync(Admin, "{\"format\":\"capreview.cycle\",\"formatVersion\":\"one\"}"u8.ToArray(), CancellationToken.None));
        Assert.StartsWith("formatVersion:", broken.Problems.Single().Message, StringComparison.Ordinal);

        await Assert.ThrowsAsync<CapReview.Reviews.Common.AccessDeniedException>(() => importer.ImportAsync(Actor.Of("x", "Board", Role.Reviewer), exported, CancellationToken.None));
        Assert.Equal(before, await CountAsync());

        // The same cycle under another name: every reference is taken here, so each takes the next free number.
        JsonNode copy = JsonNode.Parse(exported)!;
        copy["cycle"]!["name"] = "Capital plan 2027 (second installation's copy)";
        var second = await importer.ImportAsync(Admin, System.Text.Encoding.UTF8.GetBytes(copy.ToJsonString()), CancellationToken.None);
        Assert.Equal(7, second.RenamedReferences.Count);
        Assert.Equal(7, second.RenamedReferences.Values.Distinct().Count());
        Assert.DoesNotContain(second.RenamedReferences.Values, first.RenamedReferences.Keys.Concat(copy["proposals"]!.AsArray().Select(p => p!["reference"]!.GetValue<string>())).Contains);
        var renamedDocument = JsonNode.Parse(await ExportAsync(_target, "Capital plan 2027 (second installation's copy)"))!;
        // Rules and decisions follow the new references.
        Assert.All(renamedDocument["exclusiveGroups"]!.AsArray().SelectMany(g => g!["members"]!.AsArray()), m => Assert.Contains(m!.GetValue<string>(), second.RenamedReferences.Values));
    }
}
