#!/usr/bin/env bash
# Runs the test suite on a machine with only the .NET 10 SDK: installs what the tests need beyond it
# (LightGBM's OpenMP runtime libgomp, headless Chromium for the report page's browser test), then runs every test.
# Installing needs root (CI runs as root); without it, the script names what is missing and stops.
set -euo pipefail
cd "$(dirname "$0")"
export DOTNET_CLI_TELEMETRY_OPTOUT=1 DOTNET_NOLOGO=1
need=()
ldconfig -p 2>/dev/null | grep -q 'libgomp\.so\.1' || need+=(libgomp1)
command -v chromium >/dev/null || need+=(chromium)
if [ "${#need[@]}" -gt 0 ]; then
    if [ "$(id -u)" -ne 0 ]; then
        echo "test.sh: the tests need ${need[*]}; install with: sudo apt-get install -y ${need[*]}" >&2
        exit 1
    fi
    apt-get update && apt-get install -y "${need[@]}"
fi
echo "== dotnet $(dotnet --version) on $(nproc) cores"
dotnet test Foldwise.slnx "$@"
