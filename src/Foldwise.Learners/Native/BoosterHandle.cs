using Microsoft.Win32.SafeHandles;

namespace Foldwise.Learners.Native;

/// <summary>A LightGBM Booster, freed when disposed (or, failing that, finalised).</summary>
internal sealed class BoosterHandle() : SafeHandleZeroOrMinusOneIsInvalid(ownsHandle: true)
{
    protected override bool ReleaseHandle() => LightGbmNative.BoosterFree(handle) == 0;
}
