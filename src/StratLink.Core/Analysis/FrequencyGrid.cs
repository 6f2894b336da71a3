namespace StratLink.Analysis;

/// <summary>An even frequency grid f_k = <see cref="Step"/>·(k + 1), k = 0..Count-1, in cycles per year.</summary>
public readonly record struct FrequencyGrid(double Step, int Count)
{
    public double Frequency(int k) => Step * (k + 1);

    public double[] Frequencies()
    {
        var f = new double[Count];
        for (int k = 0; k < Count; k++) f[k] = Frequency(k);
        return f;
    }
}
