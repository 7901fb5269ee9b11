using Microsoft.Win32.SafeHandles;

namespace Foldwise.Learners.Native;

/// <summary>A LightGBM Dataset, freed when disposed (or, failing that, finalised).</summary>
internal sealed class DatasetHandle() : SafeHandleZeroOrMinusOneIsInvalid(ownsHandle: true)
{
    protected override bool ReleaseHandle() => LightGbmNative.DatasetFree(handle) == 0;
}
