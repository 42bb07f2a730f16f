using CapReview.Packets.Layout;
using CapReview.Reviews.Audit;
using CapReview.Reviews.Common;
using CapReview.Reviews.Decisions;
using CapReview.Reviews.Display;
using CapReview.Reviews.Interchange;
using CapReview.Reviews.Marr;
using PdfSharp.Drawing;
using PdfSharp.Pdf;

namespace CapReview.Packets.Content;

/// <summary>Lays out a proposal's or a cycle's packet as an unsigned PDF document.</summary>
internal static class PacketComposer
{
    public static PdfDocument Proposal(ProposalPacketData data)
    {
        var f = new PacketFormat(data.Organisation.Culture, data.Organisation.CurrencyCode);
        var document = NewDocument(data.Organisation.Name, $"{data.Proposal.Reference} {data.Proposal.Title}: approval packet");
        using var flow = new PageFlow(document, data.Paper);
        PdfOutline root = flow.Bookmark($"{data.Proposal.Reference} {data.Proposal.Title}");
        Band(flow, data.Organisation.Name, "Capital review · approval packet");
        flow.Text(data.Proposal.Reference, PacketStyle.Heading2, PacketStyle.SoftBrush);
        flow.Text(data.Proposal.Title, PacketStyle.Title, PacketStyle.BrandBrush);
        flow.Text(data.Cycle.Name, PacketStyle.Heading2, PacketStyle.SoftBrush);
        flow.Gap(10);
        Stamp(flow, data.Decision.Outcome, f.Time(data.Decision.DecidedAt));
        flow.Pairs(
        [
            ("Proposal", $"{data.Proposal.Reference} {data.Proposal.Title}"),
            ("Category and risk", $"{EnumWording.Of(data.Proposal.Category)}, risk class {EnumWording.Of(data.Proposal.RiskClass).ToLowerInvariant()}"),
            ("Budget cycle", $"{data.Cycle.Name} ({f.Date(data.Cycle.OpensOn)} to {f.Date(data.Cycle.ClosesOn)})"),
            ("Decision", $"{ProposalSections.OutcomeText(data.Decision.Outcome)}, {f.Time(data.Decision.DecidedAt)}"),
            ("Version", data.Version.Number.ToString(f.Culture)),
            ("Assumptions SHA-256", data.Version.AssumptionsHash),
            ("MARR policy", $"version {data.Marr.Number}"),
            ("MARR policy SHA-256", MarrPolicyDocument.Hash(data.Marr)),
            ("Packet made", f.Time(data.GeneratedAt)),
            ("Signed with", $"{data.Signing.Subject}, SHA-1 thumbprint {data.Signing.Thumbprint}"),
            .. AuditLine(data.AuditHead),
        ]);
        flow.Gap(6);
        SigningNote(flow, data.Signing);
        flow.Note("Cautions", Cautions.Estimates, PacketStyle.Amber);
        flow.NewPage();
        ProposalSections.Write(flow, data, f, root);
        flow.Finish($"{data.Organisation.Name} · {data.Proposal.Reference} approval packet · made {f.Time(data.GeneratedAt)}");
        return document;
    }

    public static PdfDocument Cycle(CyclePacketData data)
    {
        var f = new PacketFormat(data.Organisation.Culture, data.Organisation.CurrencyCode);
        var document = NewDocument(data.Organisation.Name, $"{data.Cycle.Name}: cycle packet");
        using var flow = new PageFlow(document, data.Paper);
        flow.Bookmark("Cycle summary");
        Band(flow, data.Organisation.Name, "Capital review · cycle packet");
        flow.Text(data.Cycle.Name, PacketStyle.Title, PacketStyle.BrandBrush);
        flow.Gap(6);
        flow.Pairs(
        [
            ("Budget cycle", $"{data.Cycle.Name}, {f.Date(data.Cycle.OpensOn)} to {f.Date(data.Cycle.ClosesOn)}, {data.Cycle.Status}"),
            ("Capital limit", $"{f.Money(data.Cycle.CapitalLimit)} {f.CurrencyCode}" +
                (data.Cycle.LaterYearLimits.Count == 0 ? "" : "; later budget years " + string.Join(", ", data.Cycle.LaterYearLimits.Select(f.Money)))),
            ("MARR policy", $"version {data.Marr.Number}: {f.Percent(data.Marr.BaseRate().EffectiveAnnual())} effective, SHA-256 {MarrPolicyDocument.Hash(data.Marr)}"),
            ("Sign-offs", string.Join("; ", data.SignOffs.Select(s => $"{s.DisplayName}, {f.Time(s.SignedAt)}")) is { Length: > 0 } s ? s : "none"),
            ("Packet made", f.Time(data.GeneratedAt)),
            ("Signed with", $"{data.Signing.Subject}, SHA-1 thumbprint {data.Signing.Thumbprint}"),
            .. AuditLine(data.AuditHead),
        ]);
        flow.Gap(4);
        SigningNote(flow, data.Signing);
        if (data.Import is { } import && data.Decided.Any(d => CycleImporter.IsImported(d.Decision.DecidedBy)))
        {
            flow.Note("Imported record",
                $"The decisions marked “imported” reproduce a record from {import.Installation} (document SHA-256 {import.DocumentSha256}), " +
                $"imported by {import.ImportedByName} on {f.Time(import.ImportedAt)}. They were not made in this installation; its board signed them off as listed.",
                PacketStyle.Amber);
        }

        flow.Heading("Decisions", PacketStyle.Heading1);
        TableWriter.Draw(flow, [new("Proposal", 3.4), new("Decision", 1.5), new("Version", 0.8, true), new("Assumptions SHA-256", 2.6)],
            data.Decided.OrderBy(d => d.Proposal.Reference, StringComparer.Ordinal).Select(d => new TableRow(
            [
                $"{d.Proposal.Reference} {d.Proposal.Title}",
                ProposalSections.OutcomeText(d.Decision.Outcome) + (CycleImporter.IsImported(d.Decision.DecidedBy) ? " (imported)" : ""),
                d.Decision.VersionNumber.ToString(f.Culture),
                d.Decision.AssumptionsHash[..16] + "…",
            ])));
        // A decision recorded against the board's own rules says so in the record, with the member's reason.
        foreach (var (proposal, decision) in data.Decided.Where(d => d.Decision.Overrides).OrderBy(d => d.Proposal.Reference, StringComparer.Ordinal))
        {
            flow.Note($"Override: {proposal.Reference}",
                $"{ProposalSections.OutcomeText(decision.Outcome)} on {f.Time(decision.DecidedAt)} although it breaks the board's rules: {decision.OverriddenRules}. Reason given: {decision.OverrideReason}",
                PacketStyle.Amber);
        }
        if (data.Portfolio is { } portfolio)
        {
            CycleSections.RankingAndPortfolio(flow, portfolio, data, f);
        }
        flow.Note("Cautions", Cautions.Estimates, PacketStyle.Amber);

        foreach (var (proposal, decision) in data.Decided.OrderBy(d => d.Proposal.Reference, StringComparer.Ordinal))
        {
            flow.NewPage();
            PdfOutline node = flow.Bookmark($"{proposal.Reference} {proposal.Title}");
            flow.Text(proposal.Reference + " · " + ProposalSections.OutcomeText(decision.Outcome), PacketStyle.Heading2, PacketStyle.SoftBrush);
            flow.Text(proposal.Title, PacketStyle.Heading1, PacketStyle.BrandBrush);
            flow.Rule();
            var one = new ProposalPacketData(data.Organisation, data.Cycle, data.Marr, proposal, decision, data.Figures[proposal.Id], data.SignOffs, data.GeneratedAt, data.Signing, data.Paper);
            ProposalSections.Write(flow, one, f, node);
        }
        flow.Finish($"{data.Organisation.Name} · {data.Cycle.Name} cycle packet · made {f.Time(data.GeneratedAt)}");
        return document;
    }

    /// <summary>The audit chain's head when the packet was signed: a record outside the database's reach (docs/security.md).</summary>
    private static (string, string)[] AuditLine(AuditHead? head) =>
        head is null ? [] : [("Audit trail", $"{head.Count.ToString(System.Globalization.CultureInfo.InvariantCulture)} events at signing, last hash {head.Hash}")];

    private static PdfDocument NewDocument(string organisation, string title)
    {
        var document = new PdfDocument();
        document.Info.Title = title;
        document.Info.Author = organisation;
        document.Info.Creator = "CapReview";
        document.Info.Subject = "Capital review record";
        document.PageLayout = PdfPageLayout.SinglePage;
        document.PageMode = PdfPageMode.UseOutlines;
        return document;
    }

    /// <summary>The ink-blue band across the top of a cover with the organisation's name.</summary>
    private static void Band(PageFlow flow, string organisation, string caption)
    {
        var g = flow.Graphics;
        g.DrawRectangle(PacketStyle.BrandBrush, 0, 0, flow.Page.Width.Point, 78);
        g.DrawRectangle(new XSolidBrush(PacketStyle.Amber), 0, 78, flow.Page.Width.Point, 3);
        g.DrawString(organisation, PacketStyle.Heading1, PacketStyle.WhiteBrush, new XRect(flow.Left, 24, flow.Width, 20), XStringFormats.TopLeft);
        g.DrawString(caption, PacketStyle.Small, new XSolidBrush(PacketStyle.Amber), new XRect(flow.Left, 46, flow.Width, 12), XStringFormats.TopLeft);
        flow.Y = 110;
    }

    /// <summary>The decision in a coloured frame: green approved, red-brown rejected, amber returned.</summary>
    private static void Stamp(PageFlow flow, DecisionOutcome outcome, string when)
    {
        XColor color = outcome switch
        {
            DecisionOutcome.Approve => PacketStyle.Receipt,
            DecisionOutcome.Reject => PacketStyle.Payment,
            _ => PacketStyle.Amber,
        };
        flow.Ensure(54);
        var box = new XRect(flow.Left, flow.Y, 230, 46);
        flow.Graphics.DrawRectangle(new XPen(color, 2), box);
        flow.Graphics.DrawString(ProposalSections.OutcomeText(outcome).ToUpperInvariant(), PacketStyle.Figure, new XSolidBrush(color), new XRect(box.X + 10, box.Y + 6, box.Width - 20, 20), XStringFormats.TopLeft);
        flow.Graphics.DrawString(when, PacketStyle.Small, PacketStyle.SoftBrush, new XRect(box.X + 10, box.Y + 28, box.Width - 20, 12), XStringFormats.TopLeft);
        flow.Y += 58;
    }

    private static void SigningNote(PageFlow flow, SigningNotice signing)
    {
        if (signing.Development)
        {
            flow.Note("Development signature: not the organisation's",
                "This packet is signed with a development certificate that this installation made for itself because no organisation certificate is configured. " +
                "The signature shows whether the file has changed since it was made, but not who made it: it is not valid as the organisation's signature for an audit.",
                PacketStyle.Payment);
        }
        else
        {
            flow.Text("The file carries the organisation's digital signature: any change to it after signing makes the signature fail in a PDF reader or in a signature checker.", PacketStyle.Small, PacketStyle.SoftBrush);
            flow.Gap(4);
        }
    }
}
