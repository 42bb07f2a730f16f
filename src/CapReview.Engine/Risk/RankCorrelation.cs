using MathNet.Numerics.Distributions;
using MathNet.Numerics.LinearAlgebra;

namespace CapReview.Engine.Risk;

/// <summary>A wanted rank correlation between two parameters, by name.</summary>
public sealed record Correlation(string First, string Second, double Coefficient);

/// <summary>
/// Induces rank correlation between independently drawn samples by the method of R. L. Iman and W. J. Conover ("A
/// distribution-free approach to inducing rank correlation among input variables", Communications in Statistics B
/// 11(3), 1982; from memory): van der Waerden scores in random order, transformed by Cholesky factors to the wanted
/// correlation, then each parameter's samples reordered to follow the ranks of its transformed scores. Each
/// parameter keeps exactly its own drawn values; only their pairing changes.
/// </summary>
internal sealed class RankCorrelation
{
    private readonly Matrix<double> _target;

    private RankCorrelation(Matrix<double> target) => _target = target;

    /// <summary>The correlation to impose, or null when none is asked for.</summary>
    public static RankCorrelation? Of(IReadOnlyList<UncertainParameter> parameters, IReadOnlyList<Correlation>? correlations)
    {
        if (correlations is not { Count: > 0 })
        {
            return null;
        }
        int k = parameters.Count;
        var matrix = Matrix<double>.Build.DenseIdentity(k);
        foreach (Correlation c in correlations)
        {
            int a = Index(parameters, c.First), b = Index(parameters, c.Second);
            if (a == b || !(c.Coefficient > -1 && c.Coefficient < 1))
            {
                throw new ArgumentException($"The correlation of {c.First} and {c.Second} must be between −1 and 1, between two parameters.", nameof(correlations));
            }
            matrix[a, b] = matrix[b, a] = c.Coefficient;
        }
        try
        {
            _ = matrix.Cholesky();
        }
        catch (ArgumentException)
        {
            throw new ArgumentException("These correlations cannot hold together (the matrix is not positive definite).", nameof(correlations));
        }
        return new RankCorrelation(matrix);
    }

    /// <summary>Reorders each column of <paramref name="samples"/> (rows: trials) in place.</summary>
    public void Apply(double[][] samples, int rows, Random random)
    {
        int k = samples.Length;
        if (rows < 3)
        {
            return;
        }
        var scores = Matrix<double>.Build.Dense(rows, k);
        double[] waerden = [.. Enumerable.Range(1, rows).Select(i => Normal.InvCDF(0, 1, i / (rows + 1.0)))];
        for (int j = 0; j < k; j++)
        {
            int[] order = [.. Enumerable.Range(0, rows)];
            random.Shuffle(order);
            for (int i = 0; i < rows; i++)
            {
                scores[i, j] = waerden[order[i]];
            }
        }
        var actual = Correlations(scores);
        var transform = _target.Cholesky().Factor * actual.Cholesky().Factor.Inverse();
        var correlated = scores * transform.Transpose();
        for (int j = 0; j < k; j++)
        {
            double[] sorted = [.. samples[j].Take(rows).Order()];
            int[] ranks = [.. Enumerable.Range(0, rows).OrderBy(i => correlated[i, j])];
            for (int r = 0; r < rows; r++)
            {
                samples[j][ranks[r]] = sorted[r];
            }
        }
    }

    private static Matrix<double> Correlations(Matrix<double> m)
    {
        int k = m.ColumnCount;
        var result = Matrix<double>.Build.DenseIdentity(k);
        for (int a = 0; a < k; a++)
        {
            for (int b = a + 1; b < k; b++)
            {
                result[a, b] = result[b, a] = MathNet.Numerics.Statistics.Correlation.Pearson(m.Column(a), m.Column(b));
            }
        }
        return result;
    }

    private static int Index(IReadOnlyList<UncertainParameter> parameters, string name)
    {
        for (int k = 0; k < parameters.Count; k++)
        {
            if (parameters[k].Name == name)
            {
                return k;
            }
        }
        throw new ArgumentException($"There is no parameter called {name} to correlate.", nameof(name));
    }
}
