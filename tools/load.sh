#!/usr/bin/env bash
# Throughput and p99 of `tidings serve` against the ceiling handler
# (examples/ceiling.rs: parse the same request, one session read, one write),
# one after the other in one run on the same machine, with sessions in a
# private redis-server and in memory. Prints each run and the ratios.
#
#   bash tools/load.sh            # 10 s per run, 64 connections, 5,000 readers
#   DURATION=20 CONNECTIONS=64 READERS=5000 bash tools/load.sh
#
# The service runs with --reader-rate 0 and --source-rate 0: the load comes
# from one address and each of the 5,000 readers sends several messages a
# second, which the default limits (50/s per address, 1/s per reader) would
# refuse. The limits' own cost is a map lookup per request and stays in.
# Needs wrk (Debian package `wrk`) and redis-server; installs wrk if missing.
set -euo pipefail
cd "$(dirname "$0")/.."

DURATION=${DURATION:-10}
CONNECTIONS=${CONNECTIONS:-64}
THREADS=${THREADS:-2}
export READERS=${READERS:-5000}

if ! command -v wrk >/dev/null 2>&1; then
  if [ "$(id -u)" = 0 ]; then SUDO=""; else SUDO="sudo"; fi
  $SUDO apt-get install -y -qq wrk >/dev/null
fi
if [ -z "${NO_BUILD:-}" ]; then
  flock /tmp/tidings-release.lock nice cargo build --release --locked --bin tidings --example ceiling
fi
bin=${TIDINGS_BIN:-target/release/tidings}
ceiling=target/release/examples/ceiling

free_port() { python3 -c 'import socket; s=socket.socket(); s.bind(("127.0.0.1",0)); print(s.getsockname()[1]); s.close()'; }

work=$(mktemp -d)
rport=$(free_port)
redis-server --port "$rport" --bind 127.0.0.1 --save "" --appendonly no --dir "$work" --daemonize yes \
  --pidfile "$work/redis.pid" --logfile "$work/redis.log"
server_pid=""
cleanup() {
  [ -n "$server_pid" ] && kill "$server_pid" 2>/dev/null || true
  [ -f "$work/redis.pid" ] && kill "$(cat "$work/redis.pid")" 2>/dev/null || true
  rm -rf "$work"
}
trap cleanup EXIT
for _ in $(seq 1 100); do redis-cli -p "$rport" ping 2>/dev/null | grep -q PONG && break; sleep 0.05; done
redis_url="redis://127.0.0.1:$rport/"
# A fixed secret for hashing reader ids: required with Redis sessions.
export TIDINGS_ID_SECRET=${TIDINGS_ID_SECRET:-load-test-secret-not-for-production}

wait_up() {
  for _ in $(seq 1 200); do
    curl -s -o /dev/null -X POST -H 'content-type: application/json' \
      -d '{"user":"warm","text":"hello"}' "http://127.0.0.1:$1/v1/messages" && return 0
    sleep 0.05
  done
  echo "tools/load.sh: server on port $1 did not start" >&2; cat "$work"/*.log >&2; return 1
}

# CPU time (user + system) of a process in clock ticks.
cpu_ticks() { awk '{print $14 + $15}' "/proc/$1/stat"; }

# run NAME COMMAND...: starts the server, warms it up, measures, stops it.
run() {
  local name=$1; shift
  local port; port=$(free_port)
  ( "$@" "$port" ) >"$work/$name.log" 2>&1 &
  server_pid=$!
  wait_up "$port"
  wrk -t"$THREADS" -c"$CONNECTIONS" -d2s -s tools/load/mix.lua "http://127.0.0.1:$port" >/dev/null
  local before; before=$(cpu_ticks "$server_pid")
  local out; out=$(wrk -t"$THREADS" -c"$CONNECTIONS" -d"${DURATION}s" --latency -s tools/load/mix.lua "http://127.0.0.1:$port")
  local after; after=$(cpu_ticks "$server_pid")
  kill "$server_pid"; wait "$server_pid" 2>/dev/null || true; server_pid=""
  local line; line=$(grep '^RESULT' <<<"$out")
  local reqs; reqs=$(sed -E 's/.*requests=([0-9]+).*/\1/' <<<"$line")
  local cpu_us; cpu_us=$(( (after - before) * 1000000 / $(getconf CLK_TCK) / (reqs > 0 ? reqs : 1) ))
  echo "$name $line cpu_us_per_req=$cpu_us" | tee -a "$work/results"
}

ceiling_redis() { exec "$ceiling" "127.0.0.1:$1" "$redis_url"; }
ceiling_memory() { exec "$ceiling" "127.0.0.1:$1"; }
serve_redis() { exec "$bin" serve --listen "127.0.0.1:$1" --reader-rate 0 --source-rate 0 --redis-url "$redis_url"; }
serve_memory() { exec "$bin" serve --listen "127.0.0.1:$1" --reader-rate 0 --source-rate 0; }

echo "wrk -t$THREADS -c$CONNECTIONS -d${DURATION}s, $READERS readers, $(nproc) cores"
run ceiling-redis ceiling_redis
run serve-redis serve_redis
run ceiling-memory ceiling_memory
run serve-memory serve_memory

python3 - "$work/results" <<'PY'
import re, sys
r = {}
for line in open(sys.argv[1]):
    name = line.split()[0]
    r[name] = {k: float(v) for k, v in re.findall(r"(\w+)=([0-9.]+)", line)}
for store in ("redis", "memory"):
    c, s = r[f"ceiling-{store}"], r[f"serve-{store}"]
    print(f"{store:6}: serve {s['rps']:.0f} req/s p99 {s['p99_us']/1000:.2f} ms "
          f"({s['cpu_us_per_req']:.0f} µs CPU/req, {s['errors']:.0f} errors) | "
          f"ceiling {c['rps']:.0f} req/s p99 {c['p99_us']/1000:.2f} ms | "
          f"throughput ratio {s['rps']/c['rps']:.2f}, p99 ratio {s['p99_us']/max(c['p99_us'],1):.2f}")
print(f"memory/redis throughput of serve: {r['serve-memory']['rps']/r['serve-redis']['rps']:.2f}")
PY
