#!/usr/bin/env bash
# Smoke checks after the tests: the benchmark runs end to end at size S (a smoke check, not a timing).
set -euo pipefail
cd "$(dirname "$0")/.."
out=$(mktemp -d)
dotnet run --project src/PlanDesk.Cli -c Release -- bench --sizes S --seeds 1 --time-limit 30 --out "$out/bench.csv"
test -s "$out/bench.csv"
