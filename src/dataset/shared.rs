//! The dataset shared by replicas: the latest records and their version in
//! Redis, so a change applied through one replica is served by all.
//!
//! A replica that applies a change publishes the new records with
//! compare-and-set on the shared version; every replica polls the version
//! and adopts a newer one. A replica that missed changes (it was down, or
//! started late) catches up by version, since what is shared is the whole
//! latest dataset, not a stream of messages.

use std::time::Duration;

use redis::aio::{ConnectionManager, ConnectionManagerConfig};
use redis::Script;
use tokio::sync::OnceCell;

use super::changes::Records;

/// Why the shared dataset could not be read or written.
#[derive(Debug, thiserror::Error)]
pub enum SharedError {
    #[error("shared dataset unavailable: {0}")]
    Unavailable(String),
    #[error("shared dataset unreadable: {0}")]
    Corrupt(String),
}

/// Stores `records` as version ARGV[2] only if the shared version is still
/// ARGV[1] (0 when nothing is shared yet). Returns 1 when stored.
const PUBLISH_LUA: &str = r#"
local current = tonumber(redis.call('HGET', KEYS[1], 'v')) or 0
if current ~= tonumber(ARGV[1]) then
  return 0
end
redis.call('HSET', KEYS[1], 'v', ARGV[2], 'records', ARGV[3])
return 1
"#;

/// Each call's deadline, connecting included.
const DEADLINE: Duration = Duration::from_secs(2);

/// The shared dataset in one Redis.
pub struct SharedData {
    client: redis::Client,
    key: String,
    // Connected on first use, so the service starts while Redis is down;
    // the manager reconnects by itself afterwards.
    conn: OnceCell<ConnectionManager>,
    publish: Script,
}

impl std::fmt::Debug for SharedData {
    // By hand: the client's connection details may hold a password.
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        f.debug_struct("SharedData")
            .field("key", &self.key)
            .finish_non_exhaustive()
    }
}

impl SharedData {
    /// The shared dataset at `url`, under the key `{prefix}dataset`.
    pub fn new(url: &str, prefix: &str) -> Result<SharedData, SharedError> {
        let client = redis::Client::open(url)
            .map_err(|e| SharedError::Unavailable(format!("invalid redis url: {e}")))?;
        Ok(SharedData {
            client,
            key: format!("{prefix}dataset"),
            conn: OnceCell::new(),
            publish: Script::new(PUBLISH_LUA),
        })
    }

    async fn conn(&self) -> Result<ConnectionManager, SharedError> {
        let c = self
            .conn
            .get_or_try_init(|| async {
                let config = ConnectionManagerConfig::new()
                    .set_connection_timeout(Some(Duration::from_millis(500)))
                    .set_response_timeout(Some(Duration::from_secs(1)))
                    .set_number_of_retries(1);
                self.client.get_connection_manager_with_config(config).await
            })
            .await
            .map_err(|e| SharedError::Unavailable(e.to_string()))?;
        Ok(c.clone())
    }

    async fn within<T>(
        &self,
        work: impl std::future::Future<Output = Result<T, SharedError>>,
    ) -> Result<T, SharedError> {
        tokio::time::timeout(DEADLINE, work)
            .await
            .unwrap_or_else(|_| {
                Err(SharedError::Unavailable(
                    "redis did not answer in time".into(),
                ))
            })
    }

    /// The shared version, 0 when nothing is shared yet.
    pub async fn version(&self) -> Result<u64, SharedError> {
        self.within(async {
            let mut c = self.conn().await?;
            let v: Option<u64> = redis::cmd("HGET")
                .arg(&self.key)
                .arg("v")
                .query_async(&mut c)
                .await
                .map_err(|e| SharedError::Unavailable(e.to_string()))?;
            Ok(v.unwrap_or(0))
        })
        .await
    }

    /// The shared records and their version, if any are shared.
    pub async fn fetch(&self) -> Result<Option<(u64, Records)>, SharedError> {
        self.within(async {
            let mut c = self.conn().await?;
            let (v, json): (Option<u64>, Option<String>) = redis::cmd("HMGET")
                .arg(&self.key)
                .arg("v")
                .arg("records")
                .query_async(&mut c)
                .await
                .map_err(|e| SharedError::Unavailable(e.to_string()))?;
            match (v, json) {
                (Some(v), Some(j)) => serde_json::from_str(&j)
                    .map(|r| Some((v, r)))
                    .map_err(|e| SharedError::Corrupt(e.to_string())),
                _ => Ok(None),
            }
        })
        .await
    }

    /// Shares `records` as `version` if the shared version is still
    /// `expected`; `false` when another replica shared a change first.
    pub async fn publish(
        &self,
        expected: u64,
        version: u64,
        records: &Records,
    ) -> Result<bool, SharedError> {
        let json =
            serde_json::to_string(records).map_err(|e| SharedError::Corrupt(e.to_string()))?;
        self.within(async {
            let mut c = self.conn().await?;
            let stored: i64 = self
                .publish
                .key(&self.key)
                .arg(expected)
                .arg(version)
                .arg(json)
                .invoke_async(&mut c)
                .await
                .map_err(|e| SharedError::Unavailable(e.to_string()))?;
            Ok(stored == 1)
        })
        .await
    }
}
