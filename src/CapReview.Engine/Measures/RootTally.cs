namespace CapReview.Engine.Measures;

/// <summary>
/// The roots a rate-of-return scan has found so far, and whether the answer is already known to be "not unique".
/// Each grid interval's roots lie within it (ends included). A scanned interval that gave none and is wider than any
/// gap the merging of near-duplicate roots closes (1e-7 max(1, |root|), every root lying in the range), lying between
/// two found roots, means that the full, sorted list of roots has two neighbours further apart than the merging
/// reaches. Merging only moves a root towards the one above it, so it never narrows a gap: whatever the rest of the
/// scan finds, the merged list keeps at least two roots, and the full search would report no unique rate.
/// </summary>
internal sealed class RootTally(double lowest, double highest)
{
    private readonly double _mergeWidth = 1e-7 * Math.Max(1.0, Math.Max(Math.Abs(lowest), Math.Abs(highest)));
    private readonly List<(double From, double To)> _emptyIntervals = [];
    private double _lowestRoot = double.PositiveInfinity, _highestRoot = double.NegativeInfinity;

    public List<double> Found { get; } = new(4);

    /// <summary>True once two roots no merging can join are found; <see cref="Found"/> is then incomplete.</summary>
    public bool Settled { get; private set; }

    public void Add(double root)
    {
        Found.Add(root);
        Update(Found.Count - 1);
    }

    /// <summary>The interval from <paramref name="from"/> to <paramref name="to"/> is scanned; its roots are in <see cref="Found"/> from index <paramref name="firstNew"/> on.</summary>
    public void Scanned(double from, double to, int firstNew)
    {
        if (Found.Count > firstNew)
        {
            Update(firstNew);
        }
        else if (to - from > _mergeWidth)
        {
            _emptyIntervals.Add((from, to));
            Settled |= from >= _lowestRoot && to <= _highestRoot;
        }
    }

    private void Update(int firstNew)
    {
        for (int k = firstNew; k < Found.Count; k++)
        {
            _lowestRoot = Math.Min(_lowestRoot, Found[k]);
            _highestRoot = Math.Max(_highestRoot, Found[k]);
        }
        Settled |= _emptyIntervals.Exists(e => e.From >= _lowestRoot && e.To <= _highestRoot);
    }
}
