#!/usr/bin/env bash
# The launcher on a fresh checkout: two launches at once build once (the second waits for the
# first's build) and both run; after a source changes the next launch builds again into a new
# folder and the old one is kept (marked superseded) for commands still running from it.
set -euo pipefail
cd "$(dirname "$0")/.."
out="$(mktemp -d)"
trap 'rm -rf "$out"' EXIT

launch_two() {
  ./spindrift --help >"$out/a" 2>&1 & a=$!
  ./spindrift --help >"$out/b" 2>&1 & b=$!
  wait "$a" || { cat "$out/a"; echo "launcher-check: first launch failed" >&2; exit 1; }
  wait "$b" || { cat "$out/b"; echo "launcher-check: second launch failed" >&2; exit 1; }
  grep -q '^Usage: spindrift' "$out/a" && grep -q '^Usage: spindrift' "$out/b" \
    || { echo "launcher-check: a launch printed no usage" >&2; exit 1; }
  builds="$(cat "$out/a" "$out/b" | grep -c '^spindrift: building' || true)"
  [ "$builds" = "$1" ] || { echo "launcher-check: $builds builds, expected $1" >&2; exit 1; }
}

touch sim/src/main/java/org/spindrift/sim/cli/Main.java
first="$( [ -L .launcher/current ] && readlink -f .launcher/current || echo none )"
launch_two 1
second="$(readlink -f .launcher/current)"
[ "$first" != "$second" ] || { echo "launcher-check: no new build folder" >&2; exit 1; }
[ "$first" = none ] || [ -f "$first/.superseded" ] \
  || { echo "launcher-check: the previous build was not kept as superseded" >&2; exit 1; }
launch_two 0   # nothing changed: no build
echo "launcher-check: two launches at once built once, then none; build folder $(basename "$second")"
