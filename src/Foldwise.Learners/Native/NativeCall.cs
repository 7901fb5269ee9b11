using System.Runtime.InteropServices;

namespace Foldwise.Learners.Native;

/// <summary>Checks a C API return code; LightGBM keeps the reason of the last failure per calling thread.</summary>
internal static class NativeCall
{
    public static void Check(int code, string what)
    {
        if (code != 0)
        {
            string reason = Marshal.PtrToStringUTF8(LightGbmNative.LastError()) ?? "no reason given";
            throw new LightGbmException($"LightGBM refused {what}: {reason.Trim()}");
        }
    }
}
