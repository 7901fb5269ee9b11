namespace Foldwise.Core.Demo;

/// <summary>
/// What a new member's signing form records besides its lanes, as indices into the level names below:
/// the region of its home corridor, its trade sector and how it signed up. <see cref="Blank"/> marks a field
/// the form left empty.
/// </summary>
internal readonly record struct ShipperFacts(int Region, int Sector, int Channel)
{
    public const int Blank = -1;

    /// <summary>Shares of forms with each field left empty: the channel was not asked for at first.</summary>
    public const double RegionBlankShare = 0.04, SectorBlankShare = 0.08, ChannelBlankShare = 0.2;

    public static readonly string[] ColumnNames = ["region", "sector", "signing_channel"];

    /// <summary>Invented region names, one per home corridor (up to twelve).</summary>
    public static readonly string[] Regions =
    [
        "north coast", "south coast", "east valley", "west valley", "upper plains", "lower plains",
        "lakeside", "high ridge", "river delta", "border hills", "metro north", "metro south",
    ];

    public static readonly string[] Sectors =
    [
        "groceries", "building supplies", "farm produce", "furniture", "machinery parts", "textiles", "beverages", "paper goods",
    ];

    public static readonly string[] Channels = ["field visit", "web form", "member referral", "trade fair"];
}
