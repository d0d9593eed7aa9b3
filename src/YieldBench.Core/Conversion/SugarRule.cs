namespace YieldBench.Core.Conversion;

/// <summary>How fermentable sugar (g/L) is obtained from a must's °Brix.</summary>
public enum SugarRule
{
    /// <summary>The OIV must table (OIV-MA-AS2-02 Table II), interpolated; the default.</summary>
    OivTable,

    /// <summary>Sugar % w/v = (°Brix − 2.1) × density (a winery-handbook rule allowing about 2.1 °Brix of non-sugar solids).</summary>
    BrixMinusNonSugar,
}
