#!/bin/sh
# A spread split into shards and run by GNU parallel on this machine (or, with --sshlogin, on several), then joined.
# Usage: deploy/parallel-spread.sh [NETLIST]   (environment: RUNS, SHARDS, SEED, OUT)
# Run it from the repository root with `nightsim` on the PATH (see README: install as a .NET tool).
# The joined files are byte-identical to one unsharded `nightsim spread` with the same NETLIST, RUNS and SEED.
set -eu
NETLIST=${1:-netlists/garden-path.json}
RUNS=${RUNS:-1000}
SHARDS=${SHARDS:-4}
SEED=${SEED:-1}
OUT=${OUT:-out/spread}
seq 1 "$SHARDS" | parallel --halt now,fail=1 \
  nightsim spread "$NETLIST" --runs "$RUNS" --seed "$SEED" --workers 1 --no-progress --shard "{}/$SHARDS" --out "$OUT/shard-{}"
nightsim merge "$OUT"/shard-* --out "$OUT"
