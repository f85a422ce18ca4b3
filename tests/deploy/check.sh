#!/usr/bin/env bash
# Checks deploy/ without a cluster or a container daemon (tests/run.sh runs
# it; the processes themselves are exercised by tests/deploy.rs):
#  1. the Kubernetes manifests against the Kubernetes API's JSON schemas,
#     with kubernetes-validate (PyPI), strict: unknown fields are errors;
#  2. compose, manifests, Dockerfile, nginx template and .dockerignore
#     agree on one topology (tests/deploy/topology.py, PyYAML);
#  3. the image builds, where a container runtime can build here; where
#     none can, it says why and skips that step alone.
set -euo pipefail
cd "$(dirname "$0")/../.."

# kubernetes-validate and PyYAML in a venv of their own, made once.
venv="${TIDINGS_DEPLOY_VENV:-${XDG_CACHE_HOME:-$HOME/.cache}/tidings-deploy-venv}"
if [ ! -x "$venv/bin/kubernetes-validate" ] || ! "$venv/bin/python" -c 'import yaml' 2>/dev/null; then
  echo "tests/deploy/check.sh: installing kubernetes-validate and PyYAML into $venv"
  python3 -m venv "$venv"
  "$venv/bin/pip" install -q --disable-pip-version-check kubernetes-validate PyYAML
fi

manifests=()
for f in deploy/k8s/*.yaml; do
  # Kustomize's own file is no Kubernetes resource; topology.py checks it.
  [ "$(basename "$f")" = kustomization.yaml ] || manifests+=("$f")
done
# The oldest and the newest Kubernetes release whose schemas the validator
# ships that the manifests are meant for.
versions=(1.29.0 1.37.0)
for version in "${versions[@]}"; do
  "$venv/bin/kubernetes-validate" --strict --quiet -k "$version" "${manifests[@]}"
done
echo "deploy manifests: ${#manifests[@]} files valid against the Kubernetes ${versions[*]} schemas (kubernetes-validate --strict)"

"$venv/bin/python" tests/deploy/topology.py

# The image. A runtime builds here only with a daemon (docker) or a
# daemonless builder (podman, buildah) and a registry to pull the base
# images from.
runtime=""
why=""
if command -v docker >/dev/null 2>&1; then
  if docker info >/dev/null 2>&1; then runtime=docker; else why="docker is installed but no daemon answers"; fi
fi
if [ -z "$runtime" ] && command -v podman >/dev/null 2>&1; then
  if podman info >/dev/null 2>&1; then runtime=podman; else why="${why:+$why; }podman cannot run here"; fi
fi
if [ -z "$runtime" ] && command -v buildah >/dev/null 2>&1; then
  runtime=buildah
fi
[ -n "$runtime" ] || why="${why:-no container runtime (docker, podman, buildah) is installed}"
if [ -n "$runtime" ]; then
  base=$(sed -n 's/^ARG DEBIAN_RELEASE=//p' deploy/Dockerfile)
  if ! timeout 120 "$runtime" pull -q "debian:$base-slim" >/dev/null 2>&1; then
    why="$runtime cannot pull debian:$base-slim: no image registry is reachable"
    runtime=""
  fi
fi
if [ -z "$runtime" ]; then
  echo "deploy image: SKIPPED, not built: $why"
  exit 0
fi
tag="tidings:deploy-check-$$"
if [ "$runtime" = buildah ]; then
  # buildah builds but runs no containers: the build alone is checked.
  buildah bud -q -f deploy/Dockerfile -t "$tag" .
  buildah rmi "$tag" >/dev/null
  echo "deploy image: built with buildah"
  exit 0
fi
"$runtime" build -q -f deploy/Dockerfile -t "$tag" .
# The image's binary runs as its user and finds its built-in data.
"$runtime" run --rm "$tag" check
"$runtime" rmi "$tag" >/dev/null
echo "deploy image: built with $runtime and ran 'tidings check'"
