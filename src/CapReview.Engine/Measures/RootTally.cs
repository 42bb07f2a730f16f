namespace CapReview.Engine.Measures;

/// <summary>
/// The roots a rate-of-return scan has found, and, when only a unique root matters, whether the answer is already
/// known to be "not unique". A side of zero is scanned one grid interval at a time, upwards or downwards, and each
/// interval's roots lie within it. A root, then a whole interval with none that is wider than any gap the merging of
/// near-duplicate roots closes, then another root, means that the full, sorted list of roots has two neighbours
/// further apart than the merging reaches (merging only moves a root towards the one above it, so it never narrows a
/// gap): whatever the rest of the scan finds, the merged list keeps at least two roots. Roots already found above the
/// side count as a root behind a downward scan and ahead of an upward one. Stopping there gives the answer the full
/// scan gives.
/// </summary>
internal sealed class RootTally(double lowest, double highest, bool stopAtSecond)
{
    // RemoveNearDuplicates merges neighbours within 1e-7 max(1, |upper|); every root, merged or not, lies in the range.
    private readonly double _mergeWidth = 1e-7 * Math.Max(1.0, Math.Max(Math.Abs(lowest), Math.Abs(highest)));
    private bool _rootAhead, _rootBehind, _gapAfterRoot;

    public List<double> Found { get; } = new(4);

    /// <summary>Whether the scan may stop once the answer is known not to be a unique root.</summary>
    public bool StopAtSecond => stopAtSecond;

    /// <summary>Whether the side now scanned goes from its highest rate down.</summary>
    public bool Descending { get; private set; }

    /// <summary>True once two roots no merging can join are found; the scan then stops and <see cref="Found"/> is incomplete.</summary>
    public bool Settled { get; private set; }

    /// <summary>A side's scan begins; <paramref name="rootsAbove"/> when roots above the whole side are already found.</summary>
    public void BeginSide(bool rootsAbove, bool descending)
    {
        Descending = descending;
        _rootBehind = descending && rootsAbove;
        _rootAhead = !descending && rootsAbove;
        _gapAfterRoot = false;
    }

    public void Add(double root)
    {
        Found.Add(root);
        RootsFound();
    }

    /// <summary>The interval from <paramref name="from"/> to <paramref name="to"/> is scanned and gave <paramref name="rootsFound"/> roots.</summary>
    public void Scanned(double from, double to, int rootsFound)
    {
        if (rootsFound > 0)
        {
            RootsFound();
        }
        else if (_rootBehind && to - from > _mergeWidth)
        {
            _gapAfterRoot = true;
            Settled |= stopAtSecond && _rootAhead;
        }
    }

    private void RootsFound()
    {
        Settled |= stopAtSecond && _gapAfterRoot;
        _rootBehind = true;
        _gapAfterRoot = false;
    }
}
