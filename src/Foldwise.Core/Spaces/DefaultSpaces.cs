namespace Foldwise.Core.Spaces;

/// <summary>Each built-in family's default parameter space, as its descriptor (<see cref="FamilyDescriptors"/>) states it.</summary>
public static class DefaultSpaces
{
    public static ParameterSpace LightGbm => FamilyDescriptors.LightGbm.Space;

    public static ParameterSpace FastTree => FamilyDescriptors.FastTree.Space;

    public static ParameterSpace Forest => FamilyDescriptors.Forest.Space;

    public static ParameterSpace Gam => FamilyDescriptors.Gam.Space;

    public static ParameterSpace Linear => FamilyDescriptors.Linear.Space;

    public static ParameterSpace For(string family) => FamilyDescriptors.Get(family).Space;
}
