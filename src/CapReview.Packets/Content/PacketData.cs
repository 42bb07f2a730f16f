using System.Globalization;
using CapReview.Packets.Layout;
using CapReview.Reviews.Audit;
using CapReview.Reviews.Cycles;
using CapReview.Reviews.Decisions;
using CapReview.Reviews.Interchange;
using CapReview.Reviews.Marr;
using CapReview.Reviews.Portfolio;
using CapReview.Reviews.Proposals;

namespace CapReview.Packets.Content;

/// <summary>Who the packet is for and how it writes money and dates.</summary>
public sealed record PacketOrganisation(string Name, string CurrencyCode, CultureInfo Culture);

/// <summary>The certificate the packet is signed with, as the packet states it.</summary>
/// <param name="Subject">The certificate's subject.</param>
/// <param name="Thumbprint">Its SHA-1 thumbprint, as tools show it.</param>
/// <param name="Development">A development certificate made by this installation, not the organisation's.</param>
public sealed record SigningNotice(string Subject, string Thumbprint, bool Development);

/// <summary>
/// Everything one proposal's packet shows: the decision, the version it rests on, the cycle and its MARR, and the
/// version's figures as the domain computed them (<see cref="VersionFigures"/>): the packet lays them out.
/// </summary>
public sealed record ProposalPacketData(
    PacketOrganisation Organisation,
    BudgetCycle Cycle,
    MarrPolicyVersion Marr,
    ProposalView Proposal,
    Decision Decision,
    VersionFigures Figures,
    IReadOnlyList<SignOff> SignOffs,
    DateTimeOffset GeneratedAt,
    SigningNotice Signing,
    PaperSize Paper = PaperSize.A4,
    AuditHead? AuditHead = null)
{
    /// <summary>The version the decision was taken on.</summary>
    public VersionView Version => Proposal.Versions.Single(v => v.Number == Decision.VersionNumber);
}

/// <summary>A decided cycle's packet: its ranking and portfolio, then each decided proposal with its figures (by proposal id).</summary>
public sealed record CyclePacketData(
    PacketOrganisation Organisation,
    BudgetCycle Cycle,
    MarrPolicyVersion Marr,
    IReadOnlyList<SignOff> SignOffs,
    IReadOnlyList<(ProposalView Proposal, Decision Decision)> Decided,
    IReadOnlyDictionary<int, VersionFigures> Figures,
    PortfolioResult? Portfolio,
    DateTimeOffset GeneratedAt,
    SigningNotice Signing,
    PaperSize Paper = PaperSize.A4,
    CycleImport? Import = null,
    AuditHead? AuditHead = null);
