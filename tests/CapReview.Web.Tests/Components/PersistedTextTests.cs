using System.Security.Cryptography;
using CapReview.Web.Components;

namespace CapReview.Web.Tests.Components;

/// <summary>What a prerendered page carries to its live page: packed small enough for the circuit's first message, or not carried.</summary>
public sealed class PersistedTextTests
{
    [Fact]
    public void Text_comes_back_as_it_was_packed()
    {
        string text = string.Concat(Enumerable.Repeat("{\"reference\":\"P-0001\",\"title\":\"Kiln − heat recovery\"},", 2_000));
        string? packed = PersistedText.Pack(text);
        Assert.NotNull(packed);
        // Repeated JSON packs to a small part of itself (gzip, common practice, no source).
        Assert.True(packed.Length < text.Length / 10, $"{packed.Length} of {text.Length}");
        Assert.Equal(text, PersistedText.Unpack(packed));
    }

    [Fact]
    public void Text_too_large_to_carry_is_not_carried_so_the_live_page_reads_again()
    {
        // Random bytes do not compress: 600,000 of them in hex are well past what one circuit message may carry.
        string text = Convert.ToHexString(RandomNumberGenerator.GetBytes(600_000));
        Assert.Null(PersistedText.Pack(text));
    }

    [Fact]
    public void What_is_carried_fits_the_circuits_first_message_with_room_for_its_encodings()
    {
        // Base64 twice (the state's bytes, then the protected payload) grows text by 4/3 each time.
        Assert.True(PersistedText.MaxPackedChars * 4.0 / 3 * 4 / 3 + 64 * 1024 < PersistedText.MaxMessageBytes);
    }
}
