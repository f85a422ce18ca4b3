//! A real Redis Cluster on private ports, for the tests that need one:
//! `redis-server --cluster-enabled yes` nodes joined by
//! `redis-cli --cluster create`, stopped when the handle goes.

use std::net::TcpListener;
use std::path::PathBuf;
use std::process::{Child, Command, Stdio};
use std::time::{Duration, Instant};

/// The redis-server to run: `TIDINGS_REDIS_SERVER_BIN` (set by
/// `tests/run.sh`), else the one on the path.
fn server_bin() -> String {
    std::env::var("TIDINGS_REDIS_SERVER_BIN").unwrap_or_else(|_| "redis-server".into())
}

/// A port that is free, with its cluster bus port (port + 10000, a fixed
/// rule of Redis Cluster) free as well.
fn free_cluster_port() -> u16 {
    for _ in 0..200 {
        let port: u16 = rand::random_range(20000..50000);
        let a = TcpListener::bind(("127.0.0.1", port));
        let b = TcpListener::bind(("127.0.0.1", port + 10000));
        if a.is_ok() && b.is_ok() {
            return port;
        }
    }
    panic!("no free port pair for a cluster node");
}

/// One node.
struct Node {
    port: u16,
    child: Child,
}

/// A local cluster: `masters` masters, each with `replicas` replicas.
pub struct LocalCluster {
    nodes: Vec<Node>,
    dir: PathBuf,
}

impl LocalCluster {
    /// Starts the nodes, joins them and waits until the cluster is ok on
    /// every node.
    pub fn start(masters: usize, replicas: usize) -> LocalCluster {
        let dir =
            std::env::temp_dir().join(format!("tidings-cluster-{:016x}", rand::random::<u64>()));
        std::fs::create_dir_all(&dir).unwrap();
        let mut cluster = LocalCluster { nodes: vec![], dir };
        for _ in 0..masters * (1 + replicas) {
            let port = free_cluster_port();
            let conf = cluster.dir.join(format!("nodes-{port}.conf"));
            let child = Command::new(server_bin())
                .args(["--port", &port.to_string(), "--bind", "127.0.0.1"])
                .args(["--cluster-enabled", "yes"])
                .arg("--cluster-config-file")
                .arg(&conf)
                // Short, so a killed master is replaced within seconds.
                .args(["--cluster-node-timeout", "1000"])
                .args(["--save", "", "--appendonly", "no"])
                .arg("--dir")
                .arg(&cluster.dir)
                .stdout(Stdio::null())
                .stderr(Stdio::null())
                .spawn()
                .unwrap_or_else(|e| panic!("cannot start {} ({e})", server_bin()));
            cluster.nodes.push(Node { port, child });
        }
        for n in &cluster.nodes {
            wait_for(&format!("node {} to answer", n.port), || {
                cli(n.port, &["PING"]).trim() == "PONG"
            });
        }
        let addrs: Vec<String> = cluster
            .nodes
            .iter()
            .map(|n| format!("127.0.0.1:{}", n.port))
            .collect();
        let out = Command::new("redis-cli")
            .arg("--cluster")
            .arg("create")
            .args(&addrs)
            .args(["--cluster-replicas", &replicas.to_string(), "--cluster-yes"])
            .output()
            .expect("redis-cli runs");
        assert!(
            out.status.success(),
            "redis-cli --cluster create failed: {}{}",
            String::from_utf8_lossy(&out.stdout),
            String::from_utf8_lossy(&out.stderr)
        );
        for n in &cluster.nodes {
            wait_for(&format!("node {} to see the cluster ok", n.port), || {
                cli(n.port, &["CLUSTER", "INFO"]).contains("cluster_state:ok")
            });
        }
        // Every replica in sync with its master, so a failover loses nothing.
        for n in &cluster.nodes {
            wait_for(&format!("node {} to settle its role", n.port), || {
                let info = cli(n.port, &["INFO", "replication"]);
                info.contains("role:master") || info.contains("master_link_status:up")
            });
        }
        cluster
    }

    /// The nodes' URLs, separated by commas, as `--redis-url` takes them
    /// with `--redis-cluster`.
    pub fn urls(&self) -> String {
        self.nodes
            .iter()
            .map(|n| format!("redis://127.0.0.1:{}/", n.port))
            .collect::<Vec<_>>()
            .join(",")
    }

    /// The ports of the nodes that are masters now.
    pub fn masters(&self) -> Vec<u16> {
        self.nodes
            .iter()
            .filter(|n| cli(n.port, &["ROLE"]).starts_with("master"))
            .map(|n| n.port)
            .collect()
    }

    /// The port of the master serving `key`'s slot.
    pub fn master_of(&self, key: &str) -> u16 {
        let slot = self.slot_of(key);
        for port in self.masters() {
            let nodes = cli(port, &["CLUSTER", "NODES"]);
            let mine = nodes
                .lines()
                .find(|l| l.contains("myself"))
                .unwrap_or_default();
            if owns_slot(mine, slot) {
                return port;
            }
        }
        panic!("no master owns slot {slot}");
    }

    /// The slot of `key`, as the cluster computes it.
    pub fn slot_of(&self, key: &str) -> u16 {
        cli(self.nodes[0].port, &["CLUSTER", "KEYSLOT", key])
            .trim()
            .parse()
            .expect("CLUSTER KEYSLOT answers a number")
    }

    /// A replica of the master at `port`.
    pub fn replica_of(&self, port: u16) -> u16 {
        let id = cli(port, &["CLUSTER", "MYID"]).trim().to_string();
        self.nodes
            .iter()
            .map(|n| n.port)
            .find(|&p| {
                p != port
                    && cli(p, &["CLUSTER", "NODES"])
                        .lines()
                        .any(|l| l.contains("myself") && l.contains(&format!("slave {id}")))
            })
            .unwrap_or_else(|| panic!("the master at {port} has no replica"))
    }

    /// Every key under `prefix`, from every master (SCAN per node).
    pub fn keys_under(&self, prefix: &str) -> Vec<String> {
        let mut keys = vec![];
        for port in self.masters() {
            let out = Command::new("redis-cli")
                .args(["-p", &port.to_string(), "--scan", "--pattern"])
                .arg(format!("{prefix}*"))
                .output()
                .expect("redis-cli runs");
            keys.extend(
                String::from_utf8_lossy(&out.stdout)
                    .lines()
                    .filter(|l| !l.is_empty())
                    .map(String::from),
            );
        }
        keys.sort();
        keys
    }

    /// Kills the node at `port` outright, as a crash would.
    pub fn kill(&mut self, port: u16) {
        if let Some(n) = self.nodes.iter_mut().find(|n| n.port == port) {
            let _ = n.child.kill();
            let _ = n.child.wait();
        }
        self.nodes.retain(|n| n.port != port);
    }
}

/// Whether a `CLUSTER NODES` line lists `slot` among its ranges.
fn owns_slot(line: &str, slot: u16) -> bool {
    line.split_whitespace().skip(8).any(|r| {
        let (a, b) = r.split_once('-').unwrap_or((r, r));
        match (a.parse::<u16>(), b.parse::<u16>()) {
            (Ok(a), Ok(b)) => (a..=b).contains(&slot),
            _ => false,
        }
    })
}

impl Drop for LocalCluster {
    fn drop(&mut self) {
        for n in &mut self.nodes {
            let _ = n.child.kill();
            let _ = n.child.wait();
        }
        let _ = std::fs::remove_dir_all(&self.dir);
    }
}

/// `redis-cli -p port args…`, its output.
pub fn cli(port: u16, args: &[&str]) -> String {
    let out = Command::new("redis-cli")
        .args(["-p", &port.to_string()])
        .args(args)
        .output()
        .expect("redis-cli runs");
    String::from_utf8_lossy(&out.stdout).into_owned()
}

/// Polls `check` every 50 ms for up to 20 s.
pub fn wait_for(what: &str, mut check: impl FnMut() -> bool) {
    let deadline = Instant::now() + Duration::from_secs(20);
    while !check() {
        assert!(Instant::now() < deadline, "timed out waiting for {what}");
        std::thread::sleep(Duration::from_millis(50));
    }
}
