#!/usr/bin/env bash
# Load test of raytable on this machine (127.0.0.1 only; never run in CI). It builds the server,
# starts it with a temporary store, creates a few revisions, then runs wrk with 64 connections for
# 60 s over a mix of pages, drawings, reports, previews and edits (scripts/load.lua), with slow
# clients alongside that send a body one byte per second. It prints requests per second, p50 and
# p99 latency, errors (which must be 0) and the server's RSS before and after.
#
#   scripts/load.sh                 # the full run
#   DURATION=10 SLOW=10 scripts/load.sh   # a short one
set -euo pipefail

cd "$(dirname "$0")/.."
DURATION=${DURATION:-60}    # seconds of wrk
CONNECTIONS=${CONNECTIONS:-64}
THREADS=${THREADS:-2}
SLOW=${SLOW:-30}            # seconds each slow client trickles its body
SLOW_CLIENTS=${SLOW_CLIENTS:-8}
TIMEOUT=${TIMEOUT:-10}      # seconds before wrk counts a request as an error (its default, 2 s, is below p99 on a busy two-core machine)

command -v wrk >/dev/null || { echo "load.sh: wrk is not installed" >&2; exit 1; }
work=$(mktemp -d)
server_pid=""
cleanup() {
	if [[ -n $server_pid ]]; then kill "$server_pid" 2>/dev/null || true; wait "$server_pid" 2>/dev/null || true; fi
	rm -rf "$work"
}
trap cleanup EXIT

go build -o "$work/raytable" ./cmd/raytable
go build -o "$work/loadtool" ./scripts/loadtool

# No write limit: this measures throughput; the limit itself has its tests (server/mw_rate_test.go).
"$work/raytable" serve --addr 127.0.0.1:0 --store "$work/store.db" --writes-per-minute 0 >"$work/server.out" 2>"$work/server.err" &
server_pid=$!
base=""
for _ in $(seq 100); do
	base=$(grep -o 'http://127\.0\.0\.1:[0-9]*' "$work/server.out" 2>/dev/null || true)
	[[ -n $base ]] && break
	sleep 0.1
done
[[ -n $base ]] || { echo "load.sh: the server did not start" >&2; cat "$work/server.err" >&2; exit 1; }

rss() { awk '/^VmRSS/ {print $2 " " $3}' "/proc/$server_pid/status"; }
# new_revision POSTs to a start route and prints the id it redirects to.
new_revision() { curl -sS -o /dev/null -w '%{redirect_url}' -X POST "$@" | sed 's#.*/r/##'; }

ids=(
	"$(new_revision "$base/demo")"
	"$(new_revision "$base/demo/michelson")"
	"$(new_revision "$base/demo/combiner")"
	"$(new_revision -H 'Content-Type: application/json' --data-binary @testdata/relay-bench.json "$base/import")"
)
mkdir "$work/forms"
for id in "${ids[@]}"; do
	[[ $id =~ ^[a-z2-7]{24}$ ]] || { echo "load.sh: could not create a revision (got '$id')" >&2; exit 1; }
	"$work/loadtool" form "$base" "$id" >"$work/forms/$id.form"
	curl -sS -o /dev/null "$base/r/$id/" # computed once before the run, as a visited link is
done

echo "server $base (pid $server_pid), revisions: ${ids[*]}"
echo "RSS before        $(rss)"
"$work/loadtool" slow "$base" "$SLOW" "$SLOW_CLIENTS" >"$work/slow.out" 2>&1 &
slow_pid=$!
RT_IDS="${ids[*]}" RT_FORMS="$work/forms" wrk -t "$THREADS" -c "$CONNECTIONS" -d "${DURATION}s" --timeout "${TIMEOUT}s" --latency \
	-s scripts/load.lua "$base" >"$work/wrk.out"
slow_status=0
wait "$slow_pid" || slow_status=$?
echo "RSS after         $(rss)"
sed -n '/^requests /,$p' "$work/wrk.out"
echo "slow clients ($SLOW_CLIENTS for ${SLOW}s, one byte per second):"
sed 's/^/  /' "$work/slow.out"
errors=$(awk '/^errors/ {print $2}' "$work/wrk.out")
if [[ $errors != 0 || $slow_status != 0 ]]; then
	echo "load.sh: FAILED (errors $errors, slow clients exit $slow_status)" >&2
	exit 1
fi
echo "load.sh: ok"
