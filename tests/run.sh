#!/usr/bin/env bash
# Runs every test the project has, on a fresh machine as on a developer's:
# installs what the tests need when it is missing (Debian packages), starts a
# private redis-server on a free port for the tests and stops it afterwards.
set -euo pipefail
cd "$(dirname "$0")/.."

need_pkgs=()
command -v redis-server >/dev/null 2>&1 || need_pkgs+=(redis-server)
# Unicode's NormalizationTest.txt, an external reference for the normaliser.
[ -e /usr/share/unicode/NormalizationTest.txt ] || [ -e /usr/share/unicode/NormalizationTest.txt.bz2 ] || need_pkgs+=(unicode-data)
command -v bzcat >/dev/null 2>&1 || need_pkgs+=(bzip2)
# WordNet 3.0's index files: the understander's list of adverbs is checked against them.
[ -e /usr/share/wordnet/index.adv ] || need_pkgs+=(wordnet-base)
# eSpeak NG renders voice replies' SSML so tests can measure the audio (tests/speech_tools.rs).
command -v espeak-ng >/dev/null 2>&1 || need_pkgs+=(espeak-ng)
# Headless Chromium and its WebDriver server drive the /desk page in a real browser
# (tests/desk.rs); TIDINGS_CHROMIUM and TIDINGS_CHROMEDRIVER point the test at other copies.
[ -n "${TIDINGS_CHROMIUM:-}" ] || command -v chromium >/dev/null 2>&1 || need_pkgs+=(chromium)
[ -n "${TIDINGS_CHROMEDRIVER:-}" ] || command -v chromedriver >/dev/null 2>&1 || need_pkgs+=(chromium-driver)
# nginx is the load balancer of the deployment test (tests/deploy.rs);
# TIDINGS_NGINX points it at another copy.
[ -n "${TIDINGS_NGINX:-}" ] || [ -x /usr/sbin/nginx ] || command -v nginx >/dev/null 2>&1 || need_pkgs+=(nginx-light)
# Venvs of their own hold the Kubernetes schema validator (tests/deploy/check.sh)
# and the OpenAPI validator (tests/openapi.rs).
python3 -c 'import ensurepip, venv' >/dev/null 2>&1 || need_pkgs+=(python3-venv)
if [ ${#need_pkgs[@]} -gt 0 ]; then
  echo "tests/run.sh: installing ${need_pkgs[*]}"
  if [ "$(id -u)" = 0 ]; then SUDO=""; else SUDO="sudo"; fi
  $SUDO apt-get update -qq
  DEBIAN_FRONTEND=noninteractive $SUDO apt-get install -y -qq "${need_pkgs[@]}" >/dev/null
fi

# prometheus_client (PyPI, the Prometheus project's Python client) in a venv of
# its own: its parser of the text format reads GET /metrics in tests/metrics.rs.
metrics_venv="${TIDINGS_METRICS_VENV:-${XDG_CACHE_HOME:-$HOME/.cache}/tidings-metrics-venv}"
if ! "$metrics_venv/bin/python" -c 'import prometheus_client.parser' >/dev/null 2>&1; then
  echo "tests/run.sh: installing prometheus_client into $metrics_venv"
  python3 -m venv "$metrics_venv"
  "$metrics_venv/bin/pip" install -q --disable-pip-version-check prometheus_client
fi
export TIDINGS_METRICS_PYTHON="$metrics_venv/bin/python"

# openapi-spec-validator (PyPI) checks GET /v1/openapi.json against the OpenAPI
# 3.1 specification's schema, and jsonschema (PyPI, which it depends on) checks
# the examples of docs/api.md against the served schemas (tests/openapi.rs).
openapi_venv="${TIDINGS_OPENAPI_VENV:-${XDG_CACHE_HOME:-$HOME/.cache}/tidings-openapi-venv}"
if ! "$openapi_venv/bin/python" -c 'import openapi_spec_validator, jsonschema' >/dev/null 2>&1; then
  echo "tests/run.sh: installing openapi-spec-validator and jsonschema into $openapi_venv"
  python3 -m venv "$openapi_venv"
  "$openapi_venv/bin/pip" install -q --disable-pip-version-check openapi-spec-validator jsonschema
fi
export TIDINGS_OPENAPI_PYTHON="$openapi_venv/bin/python"

# A free port: ask the kernel for one, then hand it to redis-server.
port=$(python3 -c 'import socket; s=socket.socket(); s.bind(("127.0.0.1",0)); print(s.getsockname()[1]); s.close()')
redis_dir=$(mktemp -d)
redis-server --port "$port" --bind 127.0.0.1 --save "" --appendonly no --dir "$redis_dir" --daemonize yes \
  --pidfile "$redis_dir/redis.pid" --logfile "$redis_dir/redis.log"
cleanup() {
  if [ -f "$redis_dir/redis.pid" ]; then kill "$(cat "$redis_dir/redis.pid")" 2>/dev/null || true; fi
  rm -rf "$redis_dir"
}
trap cleanup EXIT
# Wait for readiness rather than a fixed sleep.
for _ in $(seq 1 100); do
  if redis-cli -p "$port" ping 2>/dev/null | grep -q PONG; then break; fi
  sleep 0.05
done
redis-cli -p "$port" ping | grep -q PONG || { echo "tests/run.sh: private redis-server did not start"; cat "$redis_dir/redis.log"; exit 1; }

# deploy/: manifests against the Kubernetes schemas, one topology across
# compose, Kubernetes, the Dockerfile and nginx, the image where it can build.
bash tests/deploy/check.sh

export TIDINGS_TEST_REDIS_URL="redis://127.0.0.1:$port/"
export TIDINGS_REDIS_SERVER_BIN="$(command -v redis-server)"
cargo test --all-targets --locked "$@"
cargo test --doc --locked
