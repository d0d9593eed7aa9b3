#!/usr/bin/env bash
# Runs every worked script in this folder from the repository root; stops at the first that fails.
# Each is a .NET 10 file-based program: `dotnet run notebooks-as-scripts/NAME.cs`.
set -euo pipefail
cd "$(dirname "$0")/.."
export DOTNET_CLI_TELEMETRY_OPTOUT=1 DOTNET_NOLOGO=1
scripts=(
  notebooks-as-scripts/first-look-at-a-season.cs
  notebooks-as-scripts/is-one-strain-really-better.cs
  notebooks-as-scripts/choosing-next-years-house-factor.cs
  notebooks-as-scripts/the-ferment-that-ran-hot.cs
  notebooks-as-scripts/when-to-add-nutrients.cs
)
for script in "${scripts[@]}"; do
  echo "=== $script"
  dotnet run "$script"
  echo
done
echo "worked scripts: ${#scripts[@]} ran to the end"
