using Foldwise.Core.Spaces;

namespace Foldwise.Core.Events;

/// <summary>How far a family's trials went against its full budget, in the family's own budget unit.</summary>
public sealed record FamilyReach(string Family, int Furthest, int FullBudget)
{
    /// <summary>For example "lightgbm 30 of 90 rounds".</summary>
    public override string ToString() =>
        string.Create(System.Globalization.CultureInfo.InvariantCulture, $"{Family} {Furthest} of {FamilyDescriptors.UnitOf(Family).Count(FullBudget)}");
}
