#!/usr/bin/env bash
# Coverage-guided fuzzing of intake's readers: AFL++ (Debian package afl++) drives SharpFuzz 2.3.0's harness
# fuzz/YieldBench.Fuzz, whose target reads each input as one .csv, .xlsx, .xls, .ods, .tsv or .txt file (the
# input's first byte picks which) and fails on any exception or unbalanced row accounting; afl-fuzz also saves any
# input that runs longer than the time limit as a hang.
#
#   fuzz/run.sh [SECONDS] [WORK-FOLDER]      # default 600 s, TestResults/fuzz
#
# It builds the harness, instruments the reader assemblies (YieldBench.Intake, YieldBench.Core, ExcelDataReader,
# CsvHelper) with the SharpFuzz.CommandLine tool, turns the small files of the regression corpus and the demo data
# into seed inputs, runs afl-fuzz for SECONDS, prints executions, paths, crashes and hangs, and exits 1 when any
# crash or hang was found (replay one with: dotnet WORK-FOLDER/bin/YieldBench.Fuzz.dll --replay FILE).
set -euo pipefail
cd "$(dirname "$0")/.."
root=$(pwd)
seconds=${1:-600}
work=${2:-$root/TestResults/fuzz}
export DOTNET_CLI_TELEMETRY_OPTOUT=1 DOTNET_NOLOGO=1

if ! command -v afl-fuzz >/dev/null 2>&1; then
  echo "fuzz: afl-fuzz is not installed (Debian: apt-get install afl++)" >&2
  exit 2
fi

rm -rf "$work/bin" "$work/seeds" "$work/findings"
mkdir -p "$work"
if [ ! -x "$work/tools/sharpfuzz" ]; then
  dotnet tool install SharpFuzz.CommandLine --version 2.3.0 --tool-path "$work/tools" >/dev/null
fi

dotnet publish fuzz/YieldBench.Fuzz -c Release -o "$work/bin" >/dev/null
for dll in YieldBench.Intake.dll YieldBench.Core.dll ExcelDataReader.dll ExcelDataReader.DataSet.dll CsvHelper.dll; do
  if [ -f "$work/bin/$dll" ]; then
    "$work/tools/sharpfuzz" "$work/bin/$dll" >/dev/null
  fi
done

# Seeds: the corpus files and demo files small enough for afl-fuzz to mutate (up to 16 KiB).
mapfile -t samples < <(find tests/YieldBench.Intake.Tests/Regression/files demo-data -type f -size -16k | LC_ALL=C sort)
dotnet "$work/bin/YieldBench.Fuzz.dll" --seed "$work/seeds" "${samples[@]}"

export AFL_SKIP_BIN_CHECK=1 AFL_I_DONT_CARE_ABOUT_MISSING_CRASHES=1 AFL_SKIP_CPUFREQ=1 AFL_NO_UI=1 AFL_FAST_CAL=1
export AFL_NO_AFFINITY=1 AFL_SHUFFLE_QUEUE=0
afl-fuzz -i "$work/seeds" -o "$work/findings" -t 10000 -m none -V "$seconds" -s 20261 -- dotnet "$work/bin/YieldBench.Fuzz.dll" \
  > "$work/afl.log" 2>&1 || { tail -n 30 "$work/afl.log" >&2; exit 2; }

stats="$work/findings/default/fuzzer_stats"
value() { awk -F: -v k="$1" '{gsub(/ /, "", $1); gsub(/^ +/, "", $2)} $1 == k {print $2}' "$stats"; }
crashes=$(value saved_crashes)
hangs=$(value saved_hangs)
echo "fuzz: ${seconds} s, $(value execs_done) executions ($(value execs_per_sec)/s), $(value corpus_count) paths" \
  "(coverage $(value bitmap_cvg)), ${crashes} crashes, ${hangs} hangs; seeds $(ls "$work/seeds" | wc -l)"
if [ "${crashes:-0}" != "0" ] || [ "${hangs:-0}" != "0" ]; then
  echo "fuzz: inputs in $work/findings/default/crashes and hangs; replay with dotnet $work/bin/YieldBench.Fuzz.dll --replay FILE" >&2
  exit 1
fi
