#!/usr/bin/env bash
# Builds what other machines install, into OUT (default artifacts/):
#   OUT/tool/Foldwise.<version>.nupkg   the .NET tool package (needs the .NET 10 runtime; command `foldwise`)
#   OUT/linux-x64/foldwise              a self-contained single file (no .NET needed)
#   OUT/win-x64/foldwise.exe            the same for Windows
# Usage: deploy/package.sh [OUT] [RID ...]   e.g. deploy/package.sh artifacts linux-x64
set -euo pipefail
cd "$(dirname "$0")/.."
out=$(realpath -m "${1:-artifacts}")
shift || true
rids=("$@")
[ "${#rids[@]}" -gt 0 ] || rids=(linux-x64 win-x64)
export DOTNET_CLI_TELEMETRY_OPTOUT=1 DOTNET_NOLOGO=1

echo "== tool package -> $out/tool"
dotnet pack src/Foldwise.Cli -c Release -o "$out/tool"

for rid in "${rids[@]}"; do
    echo "== self-contained single file for $rid -> $out/$rid"
    # Native libraries (LightGBM) are bundled and unpacked beside the program on its first start.
    dotnet publish src/Foldwise.Cli -c Release -r "$rid" --self-contained true \
        -p:PublishSingleFile=true -p:IncludeNativeLibrariesForSelfExtract=true -p:DebugType=none \
        -o "$out/$rid"
done
ls -l "$out"/tool "${rids[@]/#/$out/}"
