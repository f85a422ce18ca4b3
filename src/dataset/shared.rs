//! The dataset shared by replicas: the latest records and their version in
//! Redis, so a change applied through one replica is served by all.
//!
//! A replica that applies a change publishes the new records with
//! compare-and-set on the shared version; every replica polls the version
//! and adopts a newer one. A replica that missed changes (it was down, or
//! started late) catches up by version, since what is shared is the whole
//! latest dataset, not a stream of messages.

use std::time::Duration;

use std::sync::Arc;

use redis::Script;

use super::changes::Records;
use crate::dialogue::redis_store::RedisLink;

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

/// Each call's deadline, connecting included: longer than a session
/// call's, since a fetch carries the whole dataset.
const DEADLINE: Duration = Duration::from_secs(2);

/// The shared dataset in one Redis.
pub struct SharedData {
    // An `Arc`: the session store talks to the same Redis through the same
    // link, so a process keeps one connection.
    link: Arc<RedisLink>,
    key: String,
    publish: Script,
}

impl std::fmt::Debug for SharedData {
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        f.debug_struct("SharedData")
            .field("key", &self.key)
            .finish_non_exhaustive()
    }
}

impl SharedData {
    /// The shared dataset through `link`, under the key `{prefix}dataset`.
    pub fn on(link: Arc<RedisLink>, prefix: &str) -> SharedData {
        SharedData {
            link,
            key: format!("{prefix}dataset"),
            publish: Script::new(PUBLISH_LUA),
        }
    }

    async fn call<T, F, Fut>(&self, what: &str, f: F) -> Result<T, SharedError>
    where
        F: FnOnce(crate::dialogue::redis_store::Conn) -> Fut,
        Fut: std::future::Future<Output = redis::RedisResult<T>>,
    {
        self.link
            .call(what, DEADLINE, f)
            .await
            .map_err(SharedError::Unavailable)
    }

    /// The shared version, 0 when nothing is shared yet.
    pub async fn version(&self) -> Result<u64, SharedError> {
        let key = self.key.clone();
        let v: Option<u64> = self
            .call("the dataset version", |mut c| async move {
                redis::cmd("HGET")
                    .arg(key)
                    .arg("v")
                    .query_async(&mut c)
                    .await
            })
            .await?;
        Ok(v.unwrap_or(0))
    }

    /// The shared records and their version, if any are shared.
    pub async fn fetch(&self) -> Result<Option<(u64, Records)>, SharedError> {
        let key = self.key.clone();
        let (v, json): (Option<u64>, Option<String>) = self
            .call("the dataset", |mut c| async move {
                redis::cmd("HMGET")
                    .arg(key)
                    .arg("v")
                    .arg("records")
                    .query_async(&mut c)
                    .await
            })
            .await?;
        match (v, json) {
            (Some(v), Some(j)) => serde_json::from_str(&j)
                .map(|r| Some((v, r)))
                .map_err(|e| SharedError::Corrupt(e.to_string())),
            _ => Ok(None),
        }
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
        let mut invocation = self.publish.prepare_invoke();
        invocation
            .key(&self.key)
            .arg(expected)
            .arg(version)
            .arg(json);
        let stored: i64 = self
            .call("the dataset publish", |mut c| async move {
                invocation.invoke_async(&mut c).await
            })
            .await?;
        Ok(stored == 1)
    }
}
