#!/usr/bin/env python3
"""A bounded attack on `tidings serve` over loopback, with figures.

Starts the service itself (the release binary unless --bin says otherwise),
once per probe with the options that probe needs, and a private
redis-server on a free port for the burst. Then, one probe at a time:

  slow     connections sending one byte a second or nothing: which timeout
           closes them and when, and a normal client's p50/p99 meanwhile
           against its own figures just before (same run);
  cap      connections past the connection cap: refused with a JSON 503,
           and the WARN line that says so;
  sigterm  SIGTERM with a half-sent header open: time to exit;
  flood    one client (one source address) on 64 connections against
           another client's p50/p99 and 429s;
  burst    200 messages of one reader at once, with Redis: answered, 429
           and 503 counts, and Redis commands per message (INFO
           commandstats) against one message on its own;
  pii      messages carrying personal data: how many pieces survive on the
           unanswered list, read back through the admin API.

Everything stays on loopback: the service listens on 127.0.0.1 (another
127.x address with --host; anything else is refused), and the two clients
of the flood come from 127.0.0.2 and 127.0.0.3 so the service sees two
sources. Counts are capped and the whole run stops itself at 180 s.

    python3 tools/attack.py                 # full run, release binary (~45 s)
    python3 tools/attack.py --quick         # short timeouts, small counts (~15 s)
    python3 tools/attack.py --only slow,pii # some probes only

The last line of the output is `FIGURES {json}`, every figure printed
above it, for tests and for the record. Exit code 0 when every probe held,
1 when one did not (its line says which), 2 for a bad invocation.
"""

import argparse
import http.client
import ipaddress
import json
import os
import re
import resource
import selectors
import signal
import socket
import subprocess
import sys
import tempfile
import threading
import time

HARD_LIMIT_S = 180.0
MAX_SLOW = 600
MAX_BURST = 500
MAX_FLOOD_S = 20.0
MAX_CONNECTIONS = 64
NOW = "2027-08-14T21:10:00+01:00"
QUESTIONS = ["medal table", "who won the men's 100m?", "what's on tomorrow?",
             "how many medals has Brellmoor won"]

STARTED = time.monotonic()
CHILDREN = []
CHILDREN_LOCK = threading.Lock()


def elapsed():
    return time.monotonic() - STARTED


def say(line=""):
    print(line, flush=True)


def watchdog():
    """Ends the whole run, children included, at the hard limit."""
    time.sleep(HARD_LIMIT_S)
    say(f"attack: stopped at the {HARD_LIMIT_S:.0f} s limit")
    with CHILDREN_LOCK:
        for c in CHILDREN:
            try:
                c.kill()
            except OSError:
                pass
    os._exit(3)


def cpu_seconds(pid):
    """User and system CPU time of a process so far, from /proc (Linux)."""
    try:
        with open(f"/proc/{pid}/stat") as f:
            fields = f.read().rsplit(")", 1)[1].split()
        return (int(fields[11]) + int(fields[12])) / os.sysconf("SC_CLK_TCK")
    except (OSError, ValueError, IndexError):
        return None


def free_port(host):
    s = socket.socket()
    s.bind((host, 0))
    port = s.getsockname()[1]
    s.close()
    return port


def percentile(values, p):
    if not values:
        return None
    v = sorted(values)
    return v[min(len(v) - 1, round((len(v) - 1) * p))]


def ms(x):
    return None if x is None else round(x * 1000, 2)


class Service:
    """One `tidings serve` process with its log in a file."""

    def __init__(self, args, extra, env=None, name="serve"):
        self.host = args.host
        self.port = free_port(args.host)
        self.log_path = os.path.join(args.work, f"{name}-{self.port}.log")
        cmd = [args.bin, "serve", "--listen", f"{self.host}:{self.port}", "--now", NOW] + extra
        full_env = dict(os.environ)
        full_env.update({"TIDINGS_LOG": "tidings=info,tower_http=warn"})
        full_env.update(env or {})
        self.log = open(self.log_path, "w")
        self.proc = subprocess.Popen(cmd, stdout=self.log, stderr=self.log, env=full_env,
                                     cwd=args.repo)
        with CHILDREN_LOCK:
            CHILDREN.append(self.proc)
        self.options = " ".join(extra)
        deadline = time.monotonic() + 20
        while time.monotonic() < deadline:
            if self.proc.poll() is not None:
                raise SystemExit(f"attack: the service exited at start:\n{self.log_text()}")
            try:
                c = http.client.HTTPConnection(self.host, self.port, timeout=1)
                c.request("GET", "/healthz")
                if c.getresponse().status == 200:
                    c.close()
                    return
            except OSError:
                pass
            time.sleep(0.05)
        raise SystemExit(f"attack: the service did not answer within 20 s:\n{self.log_text()}")

    def log_text(self):
        if not self.log.closed:
            self.log.flush()
        with open(self.log_path, errors="replace") as f:
            return f.read()

    def stop(self):
        if self.proc.poll() is None:
            self.proc.send_signal(signal.SIGTERM)
            try:
                self.proc.wait(timeout=15)
            except subprocess.TimeoutExpired:
                self.proc.kill()
                self.proc.wait()
        self.log.close()


class Redis:
    """A private redis-server on a free port, no persistence."""

    def __init__(self, args):
        self.port = free_port("127.0.0.1")
        self.proc = subprocess.Popen(
            [args.redis_server, "--port", str(self.port), "--bind", "127.0.0.1",
             "--save", "", "--appendonly", "no", "--dir", args.work],
            stdout=subprocess.DEVNULL, stderr=subprocess.DEVNULL)
        with CHILDREN_LOCK:
            CHILDREN.append(self.proc)
        deadline = time.monotonic() + 10
        while time.monotonic() < deadline:
            try:
                if self.cmd("PING") == "PONG":
                    return
            except OSError:
                time.sleep(0.05)
        raise SystemExit("attack: the private redis-server did not start")

    def url(self):
        return f"redis://127.0.0.1:{self.port}/"

    def cmd(self, *parts):
        """One command over RESP; its reply (strings, ints or lists)."""
        with socket.create_connection(("127.0.0.1", self.port), timeout=5) as s:
            out = f"*{len(parts)}\r\n".encode()
            for p in parts:
                b = str(p).encode()
                out += b"$%d\r\n%s\r\n" % (len(b), b)
            s.sendall(out)
            f = s.makefile("rb")
            return _resp(f)

    def commands(self):
        """Commands run since the last reset, by name (INFO and CONFIG
        left out: they are this script's own)."""
        info = self.cmd("INFO", "commandstats")
        counts = {}
        for line in info.splitlines():
            m = re.match(r"cmdstat_([^:]+):calls=(\d+)", line)
            if m and not m.group(1).startswith(("info", "config")):
                counts[m.group(1)] = int(m.group(2))
        return counts

    def stop(self):
        self.proc.kill()
        self.proc.wait()


def _resp(f):
    line = f.readline()
    if not line:
        raise OSError("redis closed the connection")
    kind, rest = line[:1], line[1:-2]
    if kind == b"+":
        return rest.decode()
    if kind == b"-":
        raise OSError(rest.decode())
    if kind == b":":
        return int(rest)
    if kind == b"$":
        n = int(rest)
        if n < 0:
            return None
        data = f.read(n + 2)[:-2]
        return data.decode(errors="replace")
    if kind == b"*":
        return [_resp(f) for _ in range(int(rest))]
    raise OSError(f"unexpected redis reply {line!r}")


class Client:
    """A keep-alive HTTP client from one source address."""

    def __init__(self, host, port, source, timeout=15):
        self.args = (host, port)
        self.source = source
        self.timeout = timeout
        self.conn = None

    def post(self, path, body, headers=None):
        return self.request("POST", path, json.dumps(body), headers)

    def request(self, method, path, body=None, headers=None):
        """(status, headers dict, body text, seconds); status 0 when the
        connection failed."""
        h = {"content-type": "application/json"}
        h.update(headers or {})
        for attempt in range(2):
            if self.conn is None:
                self.conn = http.client.HTTPConnection(
                    *self.args, timeout=self.timeout, source_address=(self.source, 0))
            t = time.perf_counter()
            try:
                self.conn.request(method, path, body=body, headers=h)
                r = self.conn.getresponse()
                text = r.read().decode(errors="replace")
                took = time.perf_counter() - t
                if r.getheader("connection", "").lower() == "close":
                    self.close()
                return r.status, {k.lower(): v for k, v in r.getheaders()}, text, took
            except (OSError, http.client.HTTPException) as e:
                self.close()
                # A keep-alive connection the server closed between two
                # requests is retried once on a new one; a second failure
                # counts.
                if attempt == 1:
                    return 0, {}, str(e), time.perf_counter() - t
        return 0, {}, "", 0.0

    def close(self):
        if self.conn is not None:
            self.conn.close()
            self.conn = None


def message(user, text, message_id=None):
    body = {"user": user, "text": text}
    if message_id is not None:
        body["message_id"] = message_id
    return body


class Steady:
    """A normal client in a thread: one message every `every` seconds from
    `source`, rotating over readers so it stays inside the per-reader limit."""

    def __init__(self, svc, source, tag, every=0.05, readers=40):
        self.client = Client(svc.host, svc.port, source)
        self.tag, self.every, self.readers = tag, every, readers
        self.marks = []  # (time, seconds, status, retry-after)
        self.stop_flag = threading.Event()
        self.thread = threading.Thread(target=self.run, daemon=True)

    def run(self):
        i = 0
        nxt = time.monotonic()
        while not self.stop_flag.is_set():
            user = f"{self.tag}-{i % self.readers}"
            status, headers, _, took = self.client.post(
                "/v1/messages", message(user, QUESTIONS[i % len(QUESTIONS)]))
            self.marks.append((time.monotonic(), took, status, headers.get("retry-after")))
            i += 1
            nxt += self.every
            pause = nxt - time.monotonic()
            if pause > 0:
                self.stop_flag.wait(pause)
            else:
                nxt = time.monotonic()
        self.client.close()

    def start(self):
        self.thread.start()
        return self

    def stop(self):
        self.stop_flag.set()
        self.thread.join(timeout=20)

    def window(self, t0, t1):
        """Figures of the requests that started between t0 and t1."""
        got = [m for m in self.marks if t0 <= m[0] - m[1] < t1]
        times = [m[1] for m in got if m[2] == 200]
        return {
            "requests": len(got),
            "ok": sum(1 for m in got if m[2] == 200),
            "status_429": sum(1 for m in got if m[2] == 429),
            "failed": sum(1 for m in got if m[2] not in (200, 429)),
            "p50_ms": ms(percentile(times, 0.5)),
            "p99_ms": ms(percentile(times, 0.99)),
        }


# --- slow connections -------------------------------------------------------

def probe_slow(args, fig):
    n = min(args.slow, MAX_SLOW)
    header_s, idle_s = (2, 1) if args.quick else (10, 5)
    extra = ["--header-timeout", str(header_s), "--idle-timeout", str(idle_s)]
    svc = Service(args, extra, name="slow")
    say(f"slow: {n} connections, half sending one byte a second, half nothing; "
        f"service options {' '.join(extra) if args.quick else '(defaults: header 10 s, idle 5 s)'}")
    normal = Steady(svc, args.source_b, "slow-normal").start()
    base_s = 1.5 if args.quick else 3.0
    time.sleep(base_s)
    t_open = time.monotonic()
    sel = selectors.DefaultSelector()
    conns = []
    head = b"POST /v1/messages HTTP/1.1\r\nHost: tidings\r\nX-Drip: " + b"a" * 200
    for i in range(n):
        s = socket.create_connection((svc.host, svc.port), timeout=5)
        s.setblocking(False)
        c = {"sock": s, "drip": i % 2 == 0, "opened": time.monotonic(), "sent": 0,
             "closed": None, "got": b""}
        conns.append(c)
        sel.register(s, selectors.EVENT_READ, c)
    t_opened = time.monotonic()
    deadline = t_opened + header_s + idle_s + 5
    next_drip = time.monotonic()
    while time.monotonic() < deadline and any(c["closed"] is None for c in conns):
        now = time.monotonic()
        if now >= next_drip:
            for c in conns:
                if c["drip"] and c["closed"] is None and c["sent"] < len(head):
                    try:
                        c["sock"].send(head[c["sent"]:c["sent"] + 1])
                        c["sent"] += 1
                    except OSError:
                        close_conn(sel, c)
            next_drip += 1.0
        for key, _ in sel.select(timeout=max(0.0, min(0.1, next_drip - time.monotonic()))):
            c = key.data
            try:
                data = c["sock"].recv(4096)
            except BlockingIOError:
                continue
            except OSError:
                data = b""
            if data:
                c["got"] += data
            else:
                close_conn(sel, c)
    t_end = time.monotonic()
    normal.stop()
    for c in conns:
        if c["closed"] is None:
            sel.unregister(c["sock"])
            c["sock"].close()
    svc.stop()

    def closes(drip):
        return sorted(c["closed"] - c["opened"] for c in conns
                      if c["drip"] == drip and c["closed"] is not None)

    drip_t, silent_t = closes(True), closes(False)
    f = {
        "connections": n,
        "header_timeout_s": header_s,
        "idle_timeout_s": idle_s,
        "dripping": {
            "count": sum(1 for c in conns if c["drip"]),
            "closed": len(drip_t),
            "by_header_timeout": sum(1 for t in drip_t if header_s - 0.3 <= t <= header_s + 2.5),
            "first_close_s": round(drip_t[0], 2) if drip_t else None,
            "last_close_s": round(drip_t[-1], 2) if drip_t else None,
            "answered": sum(1 for c in conns if c["drip"] and b"HTTP/1.1 2" in c["got"]),
        },
        "silent": {
            "count": sum(1 for c in conns if not c["drip"]),
            "closed": len(silent_t),
            "by_idle_timeout": sum(1 for t in silent_t if idle_s - 0.3 <= t <= idle_s + 2.5),
            "first_close_s": round(silent_t[0], 2) if silent_t else None,
            "last_close_s": round(silent_t[-1], 2) if silent_t else None,
        },
        "normal_before": normal.window(t_open - base_s, t_open),
        "normal_during": normal.window(t_opened, t_end),
    }
    fig["slow"] = f
    d, s_ = f["dripping"], f["silent"]
    say(f"  one byte a second: {d['closed']}/{d['count']} closed, {d['by_header_timeout']} by the "
        f"header-read timeout ({header_s} s), between {d['first_close_s']} and {d['last_close_s']} s "
        f"after opening; {d['answered']} answered")
    say(f"  nothing sent:      {s_['closed']}/{s_['count']} closed, {s_['by_idle_timeout']} by the "
        f"idle timeout ({idle_s} s), between {s_['first_close_s']} and {s_['last_close_s']} s")
    b, du = f["normal_before"], f["normal_during"]
    say(f"  normal client before: {b['ok']}/{b['requests']} answered, p50 {b['p50_ms']} ms, "
        f"p99 {b['p99_ms']} ms; during: {du['ok']}/{du['requests']} answered, "
        f"p50 {du['p50_ms']} ms, p99 {du['p99_ms']} ms")
    held = (d["closed"] == d["count"] and s_["closed"] == s_["count"]
            and d["by_header_timeout"] == d["count"] and s_["by_idle_timeout"] == s_["count"]
            and du["requests"] > 0 and du["ok"] == du["requests"])
    return held


def close_conn(sel, c):
    if c["closed"] is None:
        c["closed"] = time.monotonic()
        try:
            sel.unregister(c["sock"])
        except (KeyError, ValueError):
            pass
        c["sock"].close()


# --- the connection cap -----------------------------------------------------

def probe_cap(args, fig):
    cap = 16 if args.quick else 512
    extra_n = min(args.extra, MAX_SLOW)
    # Held connections send nothing: long timeouts keep them open while the
    # extra ones arrive.
    extra = ["--max-connections", str(cap), "--idle-timeout", "30", "--header-timeout", "30"]
    svc = Service(args, extra, name="cap")
    say(f"cap: {cap} connections held, then {extra_n} more; service options {' '.join(extra)}")
    held = [socket.create_connection((svc.host, svc.port), timeout=5) for _ in range(cap)]
    time.sleep(1.0)  # let the service accept every one of them
    refused, json_503, codes, other = 0, 0, {}, 0
    for _ in range(extra_n):
        s = socket.create_connection((svc.host, svc.port), timeout=5)
        s.settimeout(3)
        data = b""
        try:
            while True:
                chunk = s.recv(4096)
                if not chunk:
                    break
                data += chunk
        except OSError:
            pass
        s.close()
        text = data.decode(errors="replace")
        if text.startswith("HTTP/1.1 503"):
            refused += 1
            body = text.split("\r\n\r\n", 1)[-1]
            try:
                code = json.loads(body)["error"]["code"]
                json_503 += 1
                codes[code] = codes.get(code, 0) + 1
            except (ValueError, KeyError, TypeError):
                pass
        else:
            other += 1
    for s in held:
        s.close()
    time.sleep(0.3)
    c = Client(svc.host, svc.port, args.source_b)
    after, _, _, _ = c.post("/v1/messages", message("cap-after", "medal table"))
    c.close()
    svc.stop()
    log = svc.log_text()
    warn = [ln for ln in log.splitlines() if "connection limit reached" in ln]
    f = {"cap": cap, "extra": extra_n, "refused_503": refused, "json_503": json_503,
         "codes": codes, "not_refused": other, "warn_lines": len(warn),
         "served_after": after == 200}
    fig["cap"] = f
    say(f"  past the cap: {refused}/{extra_n} refused with 503, {json_503} with a JSON body "
        f"{codes}; {len(warn)} WARN line(s) (rate-limited, one per 10 s)")
    if warn:
        say(f"  log: {strip_ansi(warn[0])[-160:]}")
    say(f"  after the held connections closed, a message was {'answered' if after == 200 else f'not answered ({after})'}")
    return (refused == extra_n and json_503 == extra_n and len(warn) >= 1 and after == 200)


def strip_ansi(s):
    return re.sub(r"\x1b\[[0-9;]*m", "", s)


# --- SIGTERM with a half-sent header ----------------------------------------

def probe_sigterm(args, fig):
    drain = 1 if args.quick else 10
    # Long header and idle timeouts, so only the drain can end the half-sent
    # request.
    extra = ["--drain-timeout", str(drain), "--header-timeout", "60", "--idle-timeout", "60"]
    svc = Service(args, extra, name="sigterm")
    say(f"sigterm: a half-sent header open, then SIGTERM; service options {' '.join(extra)}"
        + ("" if args.quick else " (drain timeout: the default)"))
    s = socket.create_connection((svc.host, svc.port), timeout=5)
    s.sendall(b"POST /v1/messages HTTP/1.1\r\nHost: tidings\r\nContent-Type: appl")
    time.sleep(0.3)
    t = time.monotonic()
    svc.proc.send_signal(signal.SIGTERM)
    try:
        code = svc.proc.wait(timeout=drain + 10)
    except subprocess.TimeoutExpired:
        code = None
    took = time.monotonic() - t
    s.close()
    svc.stop()
    log = svc.log_text()
    f = {"drain_timeout_s": drain, "exit_s": round(took, 2), "exit_code": code,
         "drain_timed_out_logged": "drain timed out" in log}
    fig["sigterm"] = f
    say(f"  exited {took:.2f} s after SIGTERM with code {code}"
        f"{', after the drain timed out (logged)' if f['drain_timed_out_logged'] else ''}")
    return code == 0 and took <= drain + 2.0


# --- a flood from one source ------------------------------------------------

def probe_flood(args, fig):
    seconds = min(args.flood_seconds, MAX_FLOOD_S)
    conns = min(args.flood_connections, MAX_CONNECTIONS)
    svc = Service(args, [], name="flood")
    say(f"flood: one client on {conns} connections from {args.source_a} for {seconds:g} s, "
        f"another from {args.source_b}; service options: defaults (50/s and burst 100 per "
        f"source, 1/s and burst 8 per reader)")
    victim = Steady(svc, args.source_b, "flood-victim", every=0.05, readers=40).start()
    base_s = 1.5 if args.quick else 3.0
    time.sleep(base_s)
    stop = threading.Event()
    results = [[] for _ in range(conns)]

    def flooder(k):
        c = Client(svc.host, svc.port, args.source_a)
        i = 0
        while not stop.is_set():
            status, headers, text, _ = c.post(
                "/v1/messages", message(f"flood-{k}-{i}", "medal table"))
            results[k].append((status, headers.get("retry-after"), text if status == 429 else ""))
            i += 1
        c.close()

    t0 = time.monotonic()
    cpu0 = cpu_seconds(svc.proc.pid)
    threads = [threading.Thread(target=flooder, args=(k,), daemon=True) for k in range(conns)]
    for t in threads:
        t.start()
    time.sleep(seconds)
    stop.set()
    for t in threads:
        t.join(timeout=20)
    t1 = time.monotonic()
    cpu1 = cpu_seconds(svc.proc.pid)
    load = os.getloadavg()[0]
    time.sleep(0.2)
    victim.stop()
    svc.stop()
    flat = [r for rs in results for r in rs]
    r429 = [r for r in flat if r[0] == 429]
    with_retry = sum(1 for r in r429 if r[1] and r[1].isdigit() and int(r[1]) >= 1)
    by_source = sum(1 for r in r429 if "this address" in r[2])
    f = {
        "connections": conns,
        "seconds": seconds,
        "flooder": {"requests": len(flat), "ok": sum(1 for r in flat if r[0] == 200),
                    "status_429": len(r429), "with_retry_after": with_retry,
                    "by_source_limit": by_source,
                    "other": sum(1 for r in flat if r[0] not in (200, 429)),
                    "per_second": round(len(flat) / max(t1 - t0, 1e-9))},
        # How much of the machine the service itself took: the rest went
        # to this script's own clients and to whatever else runs there.
        "service_cpu_s": None if cpu0 is None or cpu1 is None else round(cpu1 - cpu0, 2),
        "load_average": round(load, 2),
        "victim_before": victim.window(t0 - base_s, t0),
        "victim_during": victim.window(t0, t1),
    }
    fig["flood"] = f
    fl, vb, vd = f["flooder"], f["victim_before"], f["victim_during"]
    say(f"  flooder: {fl['requests']} requests ({fl['per_second']}/s), {fl['ok']} answered, "
        f"{fl['status_429']} 429 ({fl['with_retry_after']} with retry-after, "
        f"{fl['by_source_limit']} by the source limit), {fl['other']} other")
    if f["service_cpu_s"] is not None:
        cpu_us = f["service_cpu_s"] * 1e6 / max(fl["requests"] + vd["requests"], 1)
        say(f"  the service used {f['service_cpu_s']} s of CPU in {t1 - t0:.1f} s "
            f"({cpu_us:.0f} µs a request) on {os.cpu_count()} cores; load average {f['load_average']}")
    say(f"  other client before: p50 {vb['p50_ms']} ms, p99 {vb['p99_ms']} ms; during: "
        f"{vd['ok']}/{vd['requests']} answered, {vd['status_429']} 429, "
        f"p50 {vd['p50_ms']} ms, p99 {vd['p99_ms']} ms")
    return (fl["status_429"] > 0 and fl["with_retry_after"] == fl["status_429"]
            and fl["other"] == 0 and vd["requests"] > 0 and vd["ok"] == vd["requests"])


# --- a burst of one reader, with Redis --------------------------------------

def burst_once(svc, source, user, n, ids):
    """n messages of `user` at once, on n connections; counts by outcome."""
    barrier = threading.Barrier(n)
    out = [None] * n

    def one(i):
        c = Client(svc.host, svc.port, source)
        body = message(user, "medal table", f"{user}-m{i}" if ids else None)
        # Connect before the barrier, so the messages leave together.
        try:
            c.conn = http.client.HTTPConnection(svc.host, svc.port, timeout=15,
                                                source_address=(source, 0))
            c.conn.connect()
        except OSError:
            pass
        try:
            barrier.wait(timeout=15)
        except threading.BrokenBarrierError:
            pass
        status, headers, text, _ = c.post("/v1/messages", body)
        code = ""
        if status != 200:
            try:
                code = json.loads(text)["error"]["code"]
                if code == "rate_limited":
                    code += ":address" if "this address" in text else ":reader"
            except (ValueError, KeyError, TypeError):
                code = "?"
        out[i] = (status, code, headers.get("retry-after"))
        c.close()

    threads = [threading.Thread(target=one, args=(i,), daemon=True) for i in range(n)]
    t = time.monotonic()
    for th in threads:
        th.start()
    for th in threads:
        th.join(timeout=30)
    took = time.monotonic() - t
    got = [o for o in out if o is not None]
    codes = {}
    for o in got:
        if o[0] != 200:
            key = f"{o[0]} {o[1]}"
            codes[key] = codes.get(key, 0) + 1
    return {
        "messages": n,
        "answered": sum(1 for o in got if o[0] == 200),
        "status_429": sum(1 for o in got if o[0] == 429),
        "status_503": sum(1 for o in got if o[0] == 503),
        "other": sum(1 for o in got if o[0] not in (200, 429, 503)),
        "retry_after_on_429": sum(1 for o in got if o[0] == 429 and o[2]),
        "codes": codes,
        "seconds": round(took, 2),
    }


def probe_burst(args, fig):
    n = min(args.burst, MAX_BURST)
    if not args.redis_server:
        say("burst: no redis-server found (--redis-server or TIDINGS_REDIS_SERVER_BIN); skipped")
        fig["burst"] = {"skipped": "no redis-server"}
        return False
    redis = Redis(args)
    env = {"TIDINGS_ID_SECRET": "attack-run-secret-not-for-production"}
    f = {"messages": n}
    try:
        svc = Service(args, ["--redis-url", redis.url()], env=env, name="burst-defaults")
        say(f"burst: {n} messages of one reader at once, sessions in a private Redis")
        say("  service options: defaults (per source 50/s burst 100, per reader 1/s burst 8, "
            "a line of 8)")
        f["defaults"] = burst_once(svc, args.source_a, "burst-reader-a", n, ids=True)
        svc.stop()
        report_burst("defaults", f["defaults"])

        loose = ["--redis-url", redis.url(), "--reader-rate", "0", "--source-rate", "0",
                 "--reader-queue", str(n + 16)]
        svc = Service(args, loose, env=env, name="burst-inline")
        say(f"  service options: {' '.join(loose[2:])} (no rate limits, a line long enough "
            f"for the burst: what the line alone does)")
        # Background commands (the shared dataset's poll) over a quiet
        # second, to take out of the burst's count.
        redis.cmd("CONFIG", "RESETSTAT")
        time.sleep(1.0)
        quiet = sum(redis.commands().values())
        results = {}
        for ids in (False, True):
            tag = "ids" if ids else "no_ids"
            user = f"burst-reader-{tag}"
            single_user = f"single-reader-{tag}"
            c = Client(svc.host, svc.port, args.source_a)
            # One message alone, as a reader's second turn: the reference.
            c.post("/v1/messages", message(single_user, "medal table",
                                           f"{single_user}-0" if ids else None))
            c.post("/v1/messages", message(user, "medal table", f"{user}-x" if ids else None))
            redis.cmd("CONFIG", "RESETSTAT")
            t = time.monotonic()
            c.post("/v1/messages", message(single_user, "medal table",
                                           f"{single_user}-1" if ids else None))
            single = sum(redis.commands().values()) - quiet * (time.monotonic() - t)
            c.close()
            redis.cmd("CONFIG", "RESETSTAT")
            t = time.monotonic()
            r = burst_once(svc, args.source_a, user, n, ids)
            by_cmd = redis.commands()
            total = sum(by_cmd.values()) - quiet * (time.monotonic() - t)
            r["redis_commands"] = round(total)
            r["commands_per_answered"] = round(total / max(r["answered"], 1), 2)
            r["single_message_commands"] = round(single, 2)
            r["exists_calls"] = by_cmd.get("exists", 0)
            results[tag] = r
        svc.stop()
        f["in_line"] = results
        f["background_commands_per_s"] = quiet
        for tag, r in results.items():
            report_burst(f"in line, {'with' if tag == 'ids' else 'without'} message ids", r)
            say(f"    Redis: {r['redis_commands']} commands for {r['answered']} answered = "
                f"{r['commands_per_answered']} per message (one message alone: "
                f"{r['single_message_commands']:.0f}); EXISTS calls {r['exists_calls']}")
    finally:
        redis.stop()
    fig["burst"] = f
    d = f["defaults"]
    ok = (d["other"] == 0 and d["status_503"] == 0 and d["answered"] >= 1
          and d["retry_after_on_429"] == d["status_429"])
    for r in f["in_line"].values():
        ok = ok and r["answered"] == n
    return ok


def report_burst(name, r):
    say(f"  {name}: {r['answered']} answered, {r['status_429']} 429 ({r['retry_after_on_429']} "
        f"with retry-after), {r['status_503']} 503, {r['other']} other in {r['seconds']} s; "
        f"{r['codes'] or 'no errors'}")


# --- personal data on the unanswered list -----------------------------------

# (what it is, the message, pieces that must not be kept). The people,
# numbers and addresses are invented; 4111 1111 1111 1111 and
# 5500 0000 0000 0004 are the usual test card numbers (pass Luhn), the two
# IBANs are the usual documentation examples (pass mod-97) — from memory.
PII_PROBES = [
    ("phone, brackets and dash", "please ring me on (01632) 960-123 about the tickets",
     ["01632960123"]),
    ("phone, international with spaces", "text me on +44 1632 960 123 when the relay starts",
     ["441632960123"]),
    ("phone, dots", "my number is 01632.960.123 can you call", ["01632960123"]),
    ("phone, tel: link", "call tel:+441632960123 for the results", ["441632960123"]),
    ("phone, tel: with dashes", "tel:01632-960-123 is my line", ["01632960123"]),
    ("phone, trailing question mark", "can someone call 01632960123?", ["01632960123"]),
    ("phone, en dashes", "reach me at 01632\u2013960\u2013123 tonight", ["01632960123"]),
    ("phone, full-width digits", "my phone \uff10\uff11\uff16\uff13\uff12 \uff19\uff16\uff10\uff11\uff12\uff13",
     ["01632960123"]),
    ("phone, spelled digits", "call me on seven seven zero zero nine one two three",
     ["seven seven zero zero nine"]),
    ("card, dashes", "my card 4111-1111-1111-1111 was charged twice for tickets",
     ["4111111111111111"]),
    ("card, spaces", "refund 5500 0000 0000 0004 please", ["5500000000000004"]),
    ("card, dots in quotes", "card \"4111.1111.1111.1111\" declined at the gate",
     ["4111111111111111"]),
    ("card-length number failing Luhn", "order 4111-1111-1111-1112 missing", ["4111111111111112"]),
    ("IBAN, grouped", "send the prize to GB82 WEST 1234 5698 7654 32",
     ["gb82", "west", "12345698765432"]),
    ("IBAN, compact", "my account DE89370400440532013000 for the refund",
     ["de89", "370400440532013000"]),
    ("IBAN, lower case", "iban gb82west12345698765432 thanks", ["gb82west", "12345698765432"]),
    ("e-mail, written", "write to quill.marlow@postbox.test about the medals",
     ["quill", "marlow", "postbox"]),
    ("e-mail, spaces around @", "quill.marlow @ postbox.test is my mail",
     ["quill", "marlow", "postbox"]),
    ("e-mail, (at) and (dot)", "mail quill(at)postbox(dot)test please", ["quill", "postbox"]),
    ("e-mail, spelled out", "email me at quill dot marlow at postbox dot test",
     ["quill", "marlow", "postbox"]),
    ("e-mail, spelled out, one name", "my address is quillmarlow at postbox dot com",
     ["quillmarlow", "postbox"]),
    ("URL, https with query", "see https://tracker.example/u/quillmarlow?ref=abc for me",
     ["tracker", "quillmarlow"]),
    ("URL, www", "my page www.quillmarlow.com/about has it", ["quillmarlow"]),
    ("URL, bare domain", "visit quillmarlow.net for my results", ["quillmarlow"]),
    ("URL, spelled out", "go to quillmarlow dot com now", ["quillmarlow"]),
    ("id number shape", "my id is ab123456c can you check", ["123456"]),
]


def survives(piece, texts):
    """Whether a piece of personal data is in any kept text: a number by
    any six of its digits in a row (digits only compared, as the list
    folds punctuation), a word as written."""
    if piece.isdigit():
        digits = ["".join(ch for ch in t if ch.isdigit()) for t in texts]
        return any(piece[i:i + 6] in d for d in digits for i in range(len(piece) - 5))
    return any(piece in t for t in texts)


def probe_pii(args, fig):
    token = "attack-admin-token-" + os.urandom(8).hex()
    svc = Service(args, [], env={"TIDINGS_ADMIN_TOKEN": token}, name="pii")
    say(f"pii: {len(PII_PROBES)} messages carrying personal data, each from its own reader; "
        "service options: defaults, admin token in the environment")
    c = Client(svc.host, svc.port, args.source_b)
    statuses = {}
    for i, (_, text, _) in enumerate(PII_PROBES):
        status, _, _, _ = c.post("/v1/messages", message(f"pii-reader-{i}", text))
        statuses[status] = statuses.get(status, 0) + 1
    time.sleep(0.5)  # the list is written after the reply goes
    status, _, body, _ = c.request("GET", "/v1/admin/unanswered?limit=1000",
                                   headers={"authorization": f"Bearer {token}"})
    c.close()
    svc.stop()
    rows = json.loads(body)["unanswered"] if status == 200 else []
    texts = [r["text"] for r in rows]
    pieces = sum(len(p[2]) for p in PII_PROBES)
    survivors = []
    for name, text, secret in PII_PROBES:
        for piece in secret:
            if survives(piece, texts):
                survivors.append(f"{name}: {piece}")
    f = {"probes": len(PII_PROBES), "pieces": pieces, "replies": statuses,
         "admin_status": status, "kept_rows": len(rows), "survivors": len(survivors),
         "surviving": survivors,
         "masks": sorted({w for t in texts for w in ("link", "address", "account", "card", "number")
                          if re.search(rf"\b{w}\b", t)})}
    fig["pii"] = f
    say(f"  replies {statuses}; {len(rows)} rows kept on the unanswered list; "
        f"{len(survivors)} of {pieces} personal pieces survive; masks seen: {', '.join(f['masks'])}")
    for s_ in survivors:
        say(f"  SURVIVES {s_}")
    if args.verbose:
        for t in texts:
            say(f"    kept: {t}")
    return status == 200 and len(rows) > 0 and not survivors


PROBES = {"slow": probe_slow, "cap": probe_cap, "sigterm": probe_sigterm,
          "flood": probe_flood, "burst": probe_burst, "pii": probe_pii}


def main():
    here = os.path.dirname(os.path.abspath(__file__))
    repo = os.path.dirname(here)
    p = argparse.ArgumentParser(description=__doc__.split("\n\n")[0])
    p.add_argument("--bin", default=os.path.join(repo, "target", "release", "tidings"),
                   help="the tidings binary (default: target/release/tidings)")
    p.add_argument("--host", default="127.0.0.1", help="a 127.x address to serve on")
    p.add_argument("--quick", action="store_true",
                   help="short timeouts and small counts (about 15 s)")
    p.add_argument("--only", default=",".join(PROBES), help="probes to run, comma-separated")
    p.add_argument("--slow", type=int, help=f"slow connections (at most {MAX_SLOW})")
    p.add_argument("--extra", type=int, help="connections past the cap")
    p.add_argument("--flood-seconds", type=float, help=f"at most {MAX_FLOOD_S:g}")
    p.add_argument("--flood-connections", type=int, default=64, help=f"at most {MAX_CONNECTIONS}")
    p.add_argument("--burst", type=int, help=f"messages of one reader at once (200; quick 100; "
                   f"at most {MAX_BURST})")
    p.add_argument("--redis-server", default=os.environ.get("TIDINGS_REDIS_SERVER_BIN"))
    p.add_argument("--verbose", action="store_true", help="print the kept texts")
    args = p.parse_args()
    try:
        host = ipaddress.ip_address(args.host)
    except ValueError:
        p.error("--host must be an IPv4 loopback address such as 127.0.0.1, not a name")
    if host.version != 4 or not host.is_loopback:
        p.error(f"refusing {args.host}: this attack only runs against loopback (127.0.0.0/8)")
    only = [x.strip() for x in args.only.split(",") if x.strip()]
    unknown = [x for x in only if x not in PROBES]
    if unknown:
        p.error(f"unknown probes {unknown}; known: {', '.join(PROBES)}")
    if args.slow is None:
        args.slow = 24 if args.quick else 400
    if args.extra is None:
        args.extra = 8 if args.quick else 64
    if args.burst is None:
        # Quick runs use the debug binary in tests: half the burst keeps
        # the line well inside its 5 s wait on a busy machine.
        args.burst = 100 if args.quick else 200
    if args.flood_seconds is None:
        args.flood_seconds = 3.0 if args.quick else 10.0
    if args.slow < 2 or args.burst < 1 or args.extra < 1 or args.flood_connections < 1:
        p.error("counts must be positive (and --slow at least 2)")
    if not os.access(args.bin, os.X_OK):
        p.error(f"no binary at {args.bin}: build it (cargo build --release) or pass --bin")
    if args.redis_server is None:
        from shutil import which
        args.redis_server = which("redis-server")
    # Distinct source addresses on loopback for the two clients of the flood.
    args.source_a = "127.0.0.2" if args.host != "127.0.0.2" else "127.0.0.4"
    args.source_b = "127.0.0.3" if args.host != "127.0.0.3" else "127.0.0.5"
    args.repo = repo
    soft, hard = resource.getrlimit(resource.RLIMIT_NOFILE)
    want = min(hard, 4096) if hard != resource.RLIM_INFINITY else 4096
    if soft < want:
        resource.setrlimit(resource.RLIMIT_NOFILE, (want, hard))
    threading.Thread(target=watchdog, daemon=True).start()
    fig = {"mode": "quick" if args.quick else "full", "binary": args.bin, "probes": only}
    held = {}
    with tempfile.TemporaryDirectory(prefix="tidings-attack-") as work:
        args.work = work
        say(f"attack on {args.bin} ({fig['mode']} run, {os.cpu_count()} cores), loopback only")
        for name in only:
            t = time.monotonic()
            try:
                held[name] = bool(PROBES[name](args, fig))
            finally:
                with CHILDREN_LOCK:
                    for c in CHILDREN:
                        if c.poll() is None:
                            c.kill()
                            c.wait()
            say(f"  -> {name} {'held' if held[name] else 'DID NOT HOLD'} ({time.monotonic() - t:.1f} s)")
    fig["held"] = held
    fig["seconds"] = round(elapsed(), 1)
    say(f"attack: {sum(held.values())} of {len(held)} probes held in {fig['seconds']} s")
    say("FIGURES " + json.dumps(fig, sort_keys=True))
    return 0 if all(held.values()) else 1


if __name__ == "__main__":
    sys.exit(main())
