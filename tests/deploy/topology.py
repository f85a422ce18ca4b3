#!/usr/bin/env python3
"""Checks that deploy/ describes one topology: the compose file, the
Kubernetes manifests, the Dockerfile, the nginx template and .dockerignore
agree on ports, probes, settings, secrets and drain times.

Run by tests/deploy/check.sh (from tests/run.sh) with PyYAML. Every problem
is printed; the exit status is 1 when there is any.
"""

import os
import re
import sys
from urllib.parse import urlparse

import yaml

ROOT = os.path.abspath(os.path.join(os.path.dirname(__file__), "..", ".."))
DEPLOY = os.path.join(ROOT, "deploy")
K8S = os.path.join(DEPLOY, "k8s")

# The secrets the service takes from the environment (docs/api.md).
SECRET_KEYS = {"TIDINGS_ADMIN_TOKEN", "TIDINGS_ID_SECRET", "TIDINGS_REDIS_URL",
               "TIDINGS_METRICS_TOKEN"}
# Of those, the ones a replica cannot start without.
REQUIRED_SECRETS = {"TIDINGS_ADMIN_TOKEN", "TIDINGS_ID_SECRET"}

problems = []


def problem(where, text):
    problems.append(f"{where}: {text}")


def load(path):
    with open(path, encoding="utf-8") as f:
        return yaml.safe_load(f)


def port_of(listen):
    """The port of a TIDINGS_LISTEN value or a host:port."""
    return int(str(listen).rsplit(":", 1)[1])


def seconds(text):
    """A compose duration such as 15s or 1m30s, in seconds."""
    total, rest = 0, str(text)
    for number, unit in re.findall(r"(\d+)(h|m|s)", rest):
        total += int(number) * {"h": 3600, "m": 60, "s": 1}[unit]
    return total


# --- the Dockerfile ------------------------------------------------------

def dockerfile_stages(text):
    """The Dockerfile's instructions, continuation lines joined, split into
    stages: a list of (FROM line, [(instruction, arguments)])."""
    joined = re.sub(r"\\\n", " ", text)
    stages = []
    for line in joined.splitlines():
        line = line.strip()
        if not line or line.startswith("#"):
            continue
        word, _, args = line.partition(" ")
        word = word.upper()
        if word == "FROM":
            stages.append((args, []))
        elif stages:
            stages[-1][1].append((word, args.strip()))
    return stages


dockerfile_path = os.path.join(DEPLOY, "Dockerfile")
with open(dockerfile_path, encoding="utf-8") as f:
    dockerfile = f.read()
stages = dockerfile_stages(dockerfile)
image_uid = None
image_port = None
healthcheck_path = None
context_copies = []
if len(stages) < 2:
    problem("deploy/Dockerfile", "expected a builder stage and a runtime stage")
else:
    builder_from = stages[0][0]
    if not builder_from.startswith("rust:"):
        problem("deploy/Dockerfile", f"the first stage builds with Rust, not {builder_from!r}")
    runtime_from, runtime = stages[-1]
    if "rust" in runtime_from:
        problem("deploy/Dockerfile", "the runtime stage must not be the Rust toolchain image")
    for word, args in stages[0][1]:
        if word == "COPY" and not args.startswith("--from"):
            context_copies.extend(args.split()[:-1])
    copies = [a for w, a in runtime if w == "COPY"]
    if copies != ["--from=build /usr/local/bin/tidings /usr/local/bin/tidings"]:
        problem("deploy/Dockerfile", f"the runtime stage copies the binary only, found {copies}")
    users = [a for w, a in runtime if w == "USER"]
    if not users:
        problem("deploy/Dockerfile", "the runtime stage sets no USER")
    else:
        uid = users[-1].split(":")[0]
        if not uid.isdigit() or int(uid) == 0:
            problem("deploy/Dockerfile", f"USER must be a numeric non-root id, not {uid!r}")
        else:
            image_uid = int(uid)
    exposes = [a for w, a in runtime if w == "EXPOSE"]
    image_port = int(exposes[-1]) if exposes else None
    checks = [a for w, a in runtime if w == "HEALTHCHECK"]
    if not checks:
        problem("deploy/Dockerfile", "no HEALTHCHECK")
    else:
        m = re.search(r"GET (/\w+) HTTP", checks[-1])
        healthcheck_path = m.group(1) if m else None
    envs = " ".join(a for w, a in runtime if w == "ENV")
    m = re.search(r"TIDINGS_LISTEN=(\S+)", envs)
    if not m or port_of(m.group(1)) != image_port:
        problem("deploy/Dockerfile", "TIDINGS_LISTEN's port is the EXPOSEd port")
    entry = [a for w, a in runtime if w == "ENTRYPOINT"]
    if entry != ['["/usr/local/bin/tidings"]']:
        problem("deploy/Dockerfile", f"ENTRYPOINT runs the binary, found {entry}")

# .dockerignore keeps out everything but what the builder copies, and lets
# in everything it copies (a file the build needs but the context lacks
# fails the build only where a runtime exists).
with open(os.path.join(ROOT, ".dockerignore"), encoding="utf-8") as f:
    ignore = [l.strip() for l in f if l.strip() and not l.startswith("#")]
if not ignore or ignore[0] != "*":
    problem(".dockerignore", "starts by leaving everything out ('*')")
allowed = {l[1:].rstrip("/") for l in ignore if l.startswith("!")}
copied = {c.rstrip("/") for c in context_copies if c not in ("./", ".")}
if allowed != copied:
    problem(".dockerignore", f"lets in {sorted(allowed)}, the builder copies {sorted(copied)}")
for c in copied:
    if not os.path.exists(os.path.join(ROOT, c)):
        problem("deploy/Dockerfile", f"copies {c}, which the repository lacks")
# Files compiled into the binary come with the context; a test's fixture
# (an include after the file's #[cfg(test)]) is not built in the image.
for folder, _, names in os.walk(os.path.join(ROOT, "src")):
    for name in names:
        if not name.endswith(".rs"):
            continue
        path = os.path.join(folder, name)
        with open(path, encoding="utf-8") as f:
            source = f.read()
        tests_from = source.find("#[cfg(test)]")
        for m in re.finditer(r'include_(?:str|bytes)!\("([^"]+)"\)', source):
            if tests_from != -1 and m.start() > tests_from:
                continue
            target = os.path.relpath(os.path.normpath(os.path.join(folder, m.group(1))), ROOT)
            if target.split(os.sep)[0] not in copied:
                problem("deploy/Dockerfile", f"{os.path.relpath(path, ROOT)} builds in {target}, outside the build context")
with open(os.path.join(ROOT, "Cargo.toml"), encoding="utf-8") as f:
    cargo = f.read()
for bench in re.findall(r'\[\[bench\]\]\s*name = "([^"]+)"', cargo):
    if "benches" not in copied:
        problem("deploy/Dockerfile", f"Cargo.toml names bench {bench}; the build needs benches/")

# --- Kubernetes ----------------------------------------------------------

k8s = {}
for name in sorted(os.listdir(K8S)):
    if name.endswith(".yaml"):
        k8s[name] = load(os.path.join(K8S, name))
by_kind = {doc["kind"]: doc for doc in k8s.values()}
missing = False
for kind in ["ConfigMap", "Secret", "Deployment", "Service", "PodDisruptionBudget",
             "HorizontalPodAutoscaler", "Kustomization"]:
    if kind not in by_kind:
        problem("deploy/k8s", f"no {kind}")
        missing = True
if missing:
    print("\n".join(problems))
    sys.exit(1)

kustomized = set(by_kind["Kustomization"]["resources"])
expected = {n for n, d in k8s.items() if d["kind"] not in ("Kustomization", "Secret")}
if kustomized != expected:
    problem("deploy/k8s/kustomization.yaml", f"lists {sorted(kustomized)}, expected {sorted(expected)}")

config = by_kind["ConfigMap"]["data"]
secret = by_kind["Secret"]["stringData"]
if set(secret) != SECRET_KEYS:
    problem("deploy/k8s/secret.yaml", f"holds {sorted(secret)}, expected {sorted(SECRET_KEYS)}")
if SECRET_KEYS & set(config):
    problem("deploy/k8s/configmap.yaml", f"holds secrets {sorted(SECRET_KEYS & set(config))}")
# The sample must not be servable as it stands (the service refuses admin
# tokens under 16 characters; tests/deploy.rs starts it to see that).
if len(secret["TIDINGS_ADMIN_TOKEN"]) >= 16:
    problem("deploy/k8s/secret.yaml", "the sample admin token is long enough to be served")

dep = by_kind["Deployment"]
pod = dep["spec"]["template"]["spec"]
labels = dep["spec"]["template"]["metadata"]["labels"]
if dep["spec"]["selector"]["matchLabels"] != labels:
    problem("deployment.yaml", "the selector matches the pod labels")
if dep["spec"]["replicas"] < 2:
    problem("deployment.yaml", "at least 2 replicas")
(container,) = pod["containers"]
ports = {p["name"]: p["containerPort"] for p in container["ports"]}
k8s_port = port_of(config["TIDINGS_LISTEN"])
if ports.get("http") != k8s_port:
    problem("deployment.yaml", f"container port http {ports.get('http')} is TIDINGS_LISTEN's {k8s_port}")
if image_port != k8s_port:
    problem("deployment.yaml", f"the image exposes {image_port}, the pod listens on {k8s_port}")
for probe, path in [("readinessProbe", "/readyz"), ("livenessProbe", "/healthz"),
                    ("startupProbe", "/healthz")]:
    get = container.get(probe, {}).get("httpGet", {})
    if get.get("path") != path or get.get("port") not in ("http", k8s_port):
        problem("deployment.yaml", f"{probe} asks GET {path} on the http port, found {get}")
if healthcheck_path != container["livenessProbe"]["httpGet"]["path"]:
    problem("deploy/Dockerfile", f"HEALTHCHECK asks {healthcheck_path}, liveness asks /healthz")
refs = {(next(iter(r)), r[next(iter(r))]["name"]) for r in container["envFrom"]}
if refs != {("configMapRef", by_kind["ConfigMap"]["metadata"]["name"]),
            ("secretRef", by_kind["Secret"]["metadata"]["name"])}:
    problem("deployment.yaml", f"envFrom names the ConfigMap and the Secret, found {refs}")
res = container.get("resources", {})
for part in ("requests", "limits"):
    if not {"cpu", "memory"} <= set(res.get(part, {})):
        problem("deployment.yaml", f"resources.{part} sets cpu and memory")
psc, csc = pod.get("securityContext", {}), container.get("securityContext", {})
if psc.get("runAsNonRoot") is not True or psc.get("runAsUser") != image_uid:
    problem("deployment.yaml", f"runs as non-root user {image_uid} (the image's USER)")
if csc.get("allowPrivilegeEscalation") is not False or csc.get("readOnlyRootFilesystem") is not True \
        or csc.get("capabilities", {}).get("drop") != ["ALL"]:
    problem("deployment.yaml", "container drops every capability, no escalation, read-only root")
drain = int(config["TIDINGS_DRAIN_TIMEOUT"])
pre_stop = container["lifecycle"]["preStop"]["exec"]["command"]
pre_stop_secs = int(pre_stop[1]) if pre_stop[0] == "sleep" else 0
if pod["terminationGracePeriodSeconds"] <= pre_stop_secs + drain:
    problem("deployment.yaml", f"terminationGracePeriodSeconds exceeds preStop {pre_stop_secs} s + drain {drain} s")
rolling = dep["spec"]["strategy"]["rollingUpdate"]
if rolling.get("maxUnavailable") != 0:
    problem("deployment.yaml", "a rolling deploy keeps every replica until its successor is ready")

svc = by_kind["Service"]
if svc["spec"]["selector"] != labels:
    problem("service.yaml", "selects the Deployment's pods")
if svc["spec"]["ports"][0]["targetPort"] not in ("http", k8s_port):
    problem("service.yaml", "targets the http port")
pdb = by_kind["PodDisruptionBudget"]
if pdb["spec"]["selector"]["matchLabels"] != labels:
    problem("pdb.yaml", "selects the Deployment's pods")
if not 1 <= pdb["spec"].get("minAvailable", 0) < dep["spec"]["replicas"]:
    problem("pdb.yaml", "keeps at least one pod and lets a drain take one")
hpa = by_kind["HorizontalPodAutoscaler"]
if hpa["apiVersion"] != "autoscaling/v2":
    problem("hpa.yaml", "autoscaling/v2")
target = hpa["spec"]["scaleTargetRef"]
if (target["kind"], target["name"]) != ("Deployment", dep["metadata"]["name"]):
    problem("hpa.yaml", "scales the Deployment")
if hpa["spec"]["minReplicas"] != dep["spec"]["replicas"] or hpa["spec"]["maxReplicas"] <= hpa["spec"]["minReplicas"]:
    problem("hpa.yaml", "starts at the Deployment's replicas and can grow")
if pdb["spec"]["minAvailable"] >= hpa["spec"]["minReplicas"]:
    problem("pdb.yaml", "minAvailable below the autoscaler's floor, or drains block")

# --- compose -------------------------------------------------------------

compose = load(os.path.join(DEPLOY, "compose.yaml"))
services = compose["services"]
replicas = [n for n, s in services.items() if s.get("image", "").startswith("tidings:")]
count = sum(int(services[n].get("deploy", {}).get("replicas", 1)) for n in replicas)
if count != 2:
    problem("compose.yaml", f"two tidings replicas, found {count} ({replicas})")
redis = [n for n, s in services.items() if s.get("image", "").startswith("redis:")]
nginx = [n for n, s in services.items() if s.get("image", "").startswith("nginx:")]
if len(redis) != 1 or len(nginx) != 1:
    problem("compose.yaml", f"one redis and one nginx, found {redis} and {nginx}")
    missing = True
if missing:
    print("\n".join(problems))
    sys.exit(1)
(redis,), (nginx,) = redis, nginx
envs = [services[n]["environment"] for n in replicas]
if any(e != envs[0] for e in envs):
    problem("compose.yaml", "every replica has the same environment (they share conversations)")
env = envs[0]
for key in REQUIRED_SECRETS:
    if not re.fullmatch(r"\$\{" + key + r":\?[^}]+\}", str(env.get(key, ""))):
        problem("compose.yaml", f"{key} comes from the environment, required (${{{key}:?...}})")
# The metrics token is optional: from the environment, empty when unset.
if str(env.get("TIDINGS_METRICS_TOKEN", "")) != "${TIDINGS_METRICS_TOKEN:-}":
    problem("compose.yaml", "TIDINGS_METRICS_TOKEN comes from the environment, optional (${TIDINGS_METRICS_TOKEN:-})")
if set(env) != set(config) | SECRET_KEYS:
    problem("compose.yaml", f"settings differ from the ConfigMap and Secret: "
            f"{sorted(set(env) ^ (set(config) | SECRET_KEYS))}")
for key, value in config.items():
    if str(env.get(key)) != value:
        problem("compose.yaml", f"{key}={env.get(key)!r}, the ConfigMap says {value!r}")
redis_url = urlparse(env["TIDINGS_REDIS_URL"])
if redis_url.hostname != redis or (redis_url.port or 6379) != 6379:
    problem("compose.yaml", f"TIDINGS_REDIS_URL names the redis service on 6379, found {env['TIDINGS_REDIS_URL']}")
compose_port = port_of(env["TIDINGS_LISTEN"])
if compose_port != k8s_port:
    problem("compose.yaml", f"replicas listen on {compose_port}, the pods on {k8s_port}")
for n in replicas:
    s = services[n]
    hc = s.get("healthcheck")
    if hc is not None and healthcheck_path not in " ".join(hc.get("test", [])):
        problem("compose.yaml", f"{n} overrides the image's healthcheck")
    if s.get("depends_on", {}).get(redis, {}).get("condition") != "service_healthy":
        problem("compose.yaml", f"{n} waits for a healthy redis")
    if seconds(s.get("stop_grace_period", "10s")) <= int(env["TIDINGS_DRAIN_TIMEOUT"]):
        problem("compose.yaml", f"{n}'s stop_grace_period exceeds the drain timeout")
    if not s.get("read_only") or s.get("cap_drop") != ["ALL"]:
        problem("compose.yaml", f"{n} runs read-only without capabilities")
    if s.get("build", {}).get("dockerfile") != "deploy/Dockerfile":
        problem("compose.yaml", f"{n} builds deploy/Dockerfile")
if not services[redis].get("healthcheck"):
    problem("compose.yaml", "redis has a healthcheck")

lb = services[nginx]
lb_env = lb["environment"]
upstreams = sorted(v for k, v in lb_env.items() if k.startswith("TIDINGS_REPLICA_"))
if upstreams != sorted(f"{n}:{compose_port}" for n in replicas):
    problem("compose.yaml", f"nginx's upstreams {upstreams} are the replicas on {compose_port}")
for n in replicas:
    if lb.get("depends_on", {}).get(n, {}).get("condition") != "service_healthy":
        problem("compose.yaml", f"nginx waits for a healthy {n}")
mounts = [v.split(":") for v in lb.get("volumes", [])]
templates = [(src, dst) for src, dst, *_ in mounts if dst.startswith("/etc/nginx/templates/")]
if len(templates) != 1:
    problem("compose.yaml", "nginx mounts one template from deploy/nginx")
else:
    src, dst = templates[0]
    path = os.path.normpath(os.path.join(DEPLOY, src))
    if path != os.path.join(DEPLOY, "nginx", "tidings.conf.template") or not dst.endswith(".template"):
        problem("compose.yaml", f"nginx mounts deploy/nginx/tidings.conf.template, found {src} at {dst}")
    with open(path, encoding="utf-8") as f:
        template = f.read()
    used = set(re.findall(r"\$\{([A-Z_]+)\}", template))
    if used != set(lb_env):
        problem("deploy/nginx/tidings.conf.template", f"uses {sorted(used)}, nginx's environment sets {sorted(lb_env)}")
    published = [str(p).split(":") for p in lb.get("ports", [])]
    if [p[-1] for p in published] != [str(lb_env["TIDINGS_PROXY_LISTEN"])]:
        problem("compose.yaml", f"nginx publishes its listen port {lb_env['TIDINGS_PROXY_LISTEN']}, found {published}")
    if "/healthz" in template or "/readyz" in template:
        problem("deploy/nginx/tidings.conf.template", "passes the probes through, it does not answer them itself")
for n, s in services.items():
    if n != nginx and s.get("ports"):
        problem("compose.yaml", f"only nginx publishes a port, {n} does too")

if problems:
    print("\n".join(problems))
    sys.exit(1)
print(f"deploy topology: {len(replicas)} replicas on :{compose_port}, {redis}, {nginx} on "
      f":{lb_env['TIDINGS_PROXY_LISTEN']}; Deployment of {dep['spec']['replicas']} (HPA "
      f"{hpa['spec']['minReplicas']}-{hpa['spec']['maxReplicas']}), probes /readyz and /healthz: consistent")
