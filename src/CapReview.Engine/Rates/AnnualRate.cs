using System.Globalization;
using CapReview.Engine.Numerics;
using CapReview.Engine.Validation;

namespace CapReview.Engine.Rates;

/// <summary>
/// An annual interest rate with its basis. Converts to the effective rate of any payment period:
/// effective i → (1 + i)^(1/p) − 1; nominal r with m → (1 + r/m)^(m/p) − 1; continuous r → e^(r/p) − 1,
/// for p payment periods a year (common practice; see docs/methods.md).
/// </summary>
public readonly record struct AnnualRate
{
    /// <summary>Most compounding sub-periods a year accepted (hourly).</summary>
    public const int MaxCompoundingsPerYear = 8760;

    /// <summary>Highest effective annual rate accepted: 1000%.</summary>
    public const double MaxEffectiveAnnual = 10.0;

    private AnnualRate(double value, RateBasis basis, int compoundingsPerYear)
    {
        Value = value;
        Basis = basis;
        CompoundingsPerYear = compoundingsPerYear;
    }

    /// <summary>The quoted annual rate as a fraction (0.10 for 10%).</summary>
    public double Value { get; }

    public RateBasis Basis { get; }

    /// <summary>m for a nominal rate; 1 for effective; 0 for continuous.</summary>
    public int CompoundingsPerYear { get; }

    public static AnnualRate Effective(double value) => Create(value, RateBasis.Effective, 1);

    public static AnnualRate Nominal(double value, int compoundingsPerYear) => Create(value, RateBasis.Nominal, compoundingsPerYear);

    public static AnnualRate Continuous(double value) => Create(value, RateBasis.Continuous, 0);

    /// <summary>Creates a rate or throws; use <see cref="Check"/> first where the input comes from a user.</summary>
    public static AnnualRate Create(double value, RateBasis basis, int compoundingsPerYear)
    {
        IReadOnlyList<InputError> errors = Check(value, basis, compoundingsPerYear, "rate");
        if (errors.Count > 0)
        {
            throw new ArgumentOutOfRangeException(nameof(value), value, errors[0].Message);
        }
        return new AnnualRate(value, basis, basis == RateBasis.Nominal ? compoundingsPerYear : basis == RateBasis.Effective ? 1 : 0);
    }

    /// <summary>Names every problem with a quoted rate, with field paths under <paramref name="path"/>.</summary>
    public static IReadOnlyList<InputError> Check(double value, RateBasis basis, int compoundingsPerYear, string path)
    {
        var errors = new List<InputError>();
        if (!double.IsFinite(value))
        {
            errors.Add(new($"{path}.value", "The rate must be a finite number."));
            return errors;
        }
        if (!Enum.IsDefined(basis))
        {
            errors.Add(new($"{path}.basis", "The basis must be effective, nominal or continuous."));
            return errors;
        }
        if (basis == RateBasis.Nominal && (compoundingsPerYear < 1 || compoundingsPerYear > MaxCompoundingsPerYear))
        {
            errors.Add(new($"{path}.compoundingsPerYear", string.Create(CultureInfo.InvariantCulture,
                $"A nominal rate needs between 1 and {MaxCompoundingsPerYear} compoundings per year.")));
            return errors;
        }
        double perSubPeriod = basis == RateBasis.Nominal ? value / compoundingsPerYear : value;
        if (basis != RateBasis.Continuous && perSubPeriod <= -1.0)
        {
            errors.Add(new($"{path}.value", "The rate must be above -100% per compounding period."));
            return errors;
        }
        double effective = EffectiveAnnualOf(value, basis, compoundingsPerYear);
        if (!(effective <= MaxEffectiveAnnual) || effective <= -1.0)
        {
            errors.Add(new($"{path}.value", "The effective annual rate must be above -100% and at most 1000%."));
        }
        return errors;
    }

    /// <summary>The effective annual rate: i, (1 + r/m)^m − 1 or e^r − 1.</summary>
    public double EffectiveAnnual() => EffectiveAnnualOf(Value, Basis, CompoundingsPerYear);

    /// <summary>ln(1 + effective annual rate): the continuous rate, the common currency of every conversion here.</summary>
    public double ContinuousEquivalent() => Basis switch
    {
        RateBasis.Effective => StableMath.Log1p(Value),
        RateBasis.Nominal => CompoundingsPerYear * StableMath.Log1p(Value / CompoundingsPerYear),
        _ => Value,
    };

    /// <summary>The effective rate per payment period when there are <paramref name="periodsPerYear"/> periods a year.</summary>
    public double EffectivePerPeriod(int periodsPerYear)
    {
        if (periodsPerYear < 1 || periodsPerYear > MaxCompoundingsPerYear)
        {
            throw new ArgumentOutOfRangeException(nameof(periodsPerYear), periodsPerYear, "Periods per year must be between 1 and 8760.");
        }
        if (periodsPerYear == 1 && Basis == RateBasis.Effective)
        {
            return Value;
        }
        if (Basis == RateBasis.Nominal && periodsPerYear == CompoundingsPerYear)
        {
            return Value / CompoundingsPerYear;
        }
        return StableMath.Expm1(ContinuousEquivalent() / periodsPerYear);
    }

    /// <summary>The same rate quoted on another basis (nominal needs m).</summary>
    public AnnualRate ToBasis(RateBasis basis, int compoundingsPerYear = 1)
    {
        double continuous = ContinuousEquivalent();
        return basis switch
        {
            RateBasis.Effective => Effective(StableMath.Expm1(continuous)),
            RateBasis.Nominal => Nominal(compoundingsPerYear * StableMath.Expm1(continuous / compoundingsPerYear), compoundingsPerYear),
            _ => Continuous(continuous),
        };
    }

    /// <summary>The annual effective rate equivalent to an effective rate per period.</summary>
    public static AnnualRate FromEffectivePerPeriod(double ratePerPeriod, int periodsPerYear) =>
        Effective(AnnualEffectiveFromPeriod(ratePerPeriod, periodsPerYear));

    /// <summary>(1 + i_p)^p − 1, without building a rate (for results that may exceed the accepted range).</summary>
    public static double AnnualEffectiveFromPeriod(double ratePerPeriod, int periodsPerYear) =>
        StableMath.Expm1(periodsPerYear * StableMath.Log1p(ratePerPeriod));

    /// <summary>(1 + i)^(1/p) − 1: the effective rate per period of an effective annual rate.</summary>
    public static double PeriodFromAnnualEffective(double annualEffective, int periodsPerYear) =>
        StableMath.Expm1(StableMath.Log1p(annualEffective) / periodsPerYear);

    public override string ToString() => Basis switch
    {
        RateBasis.Effective => string.Create(CultureInfo.InvariantCulture, $"{Value:P4} effective annual"),
        RateBasis.Nominal => string.Create(CultureInfo.InvariantCulture, $"{Value:P4} nominal, compounded {CompoundingsPerYear} times a year"),
        _ => string.Create(CultureInfo.InvariantCulture, $"{Value:P4} nominal, compounded continuously"),
    };

    private static double EffectiveAnnualOf(double value, RateBasis basis, int m) => basis switch
    {
        RateBasis.Effective => value,
        RateBasis.Nominal => StableMath.Expm1(m * StableMath.Log1p(value / m)),
        _ => StableMath.Expm1(value),
    };
}
