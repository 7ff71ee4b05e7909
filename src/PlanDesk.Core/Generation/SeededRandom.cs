namespace PlanDesk.Core.Generation;

/// <summary>
/// The generator's only source of chance. System.Random with a seed uses a fixed algorithm, so a seed
/// gives the same region on every machine and .NET version; nothing here depends on hash order or culture.
/// </summary>
internal sealed class SeededRandom(int seed)
{
    private readonly Random random = new(seed);

    /// <summary>Uniform in [<paramref name="min"/>, <paramref name="max"/>).</summary>
    public double Uniform(double min, double max) => min + (max - min) * random.NextDouble();

    /// <summary>Uniform in [<paramref name="min"/>, <paramref name="max"/>) rounded to <paramref name="decimals"/>.</summary>
    public double Uniform(double min, double max, int decimals) => Round(Uniform(min, max), decimals);

    /// <summary>Log-uniform: as many plants of 20 000 to 40 000 PE as of 200 000 to 400 000.</summary>
    public double LogUniform(double min, double max) => Math.Exp(Uniform(Math.Log(min), Math.Log(max)));

    /// <summary>An integer in [<paramref name="min"/>, <paramref name="max"/>] inclusive.</summary>
    public int Int(int min, int max) => random.Next(min, max + 1);

    public bool Chance(double probability) => random.NextDouble() < probability;

    public T Pick<T>(IReadOnlyList<T> items) => items[random.Next(items.Count)];

    /// <summary>Roughly normal noise with standard deviation <paramref name="sd"/> (sum of uniforms; no Box-Muller edge cases).</summary>
    public double Noise(double sd) => (random.NextDouble() + random.NextDouble() + random.NextDouble() - 1.5) * 2.0 * sd;

    public static double Round(double value, int decimals) => Math.Round(value, decimals, MidpointRounding.AwayFromZero);

    /// <summary>Nearest multiple of <paramref name="step"/> (e.g. 10 m3, 1 000 PE).</summary>
    public static double RoundTo(double value, double step) => Math.Round(value / step, MidpointRounding.AwayFromZero) * step;
}
