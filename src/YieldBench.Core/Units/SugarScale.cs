namespace YieldBench.Core.Units;

/// <summary>The scales a must-sugar reading can be recorded in.</summary>
public enum SugarScale
{
    /// <summary>°Brix (% sucrose by mass, 20 °C).</summary>
    Brix,

    /// <summary>Specific gravity 20/20 °C (apparent, as hydrometers read).</summary>
    SpecificGravity,

    /// <summary>°Baumé, heavy-liquid scale with modulus 145.</summary>
    Baume,

    /// <summary>°Oechsle = (SG − 1) × 1000.</summary>
    Oechsle,

    /// <summary>Fermentable sugar in grams per litre of must (OIV must table).</summary>
    GramsPerLitre,

    /// <summary>
    /// °KMW (Klosterneuburger Mostwaage, also called °Babo): sugar in g per 100 g of must as the Klosterneuburg
    /// hydrometer reads it, used in Austria, Italy, Hungary and neighbouring countries; °Oechsle = KMW·(0.022·KMW + 4.54).
    /// </summary>
    Kmw,
}
