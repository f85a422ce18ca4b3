//! `tidings serve --watch`: the data and intents folders are read again
//! when their files change, without a restart.
//!
//! A changed folder is loaded and checked whole; only a version that loads
//! is served. A changed data folder replaces the data served, including
//! changes posted through the admin API since the files were last read: the
//! files are the editors' source of truth, and a warning says how many
//! versions were replaced. A broken file keeps the last good version serving, and its
//! problem (with file:line:column) is logged and shown by
//! `GET /v1/admin/status` until a later change loads.

use std::path::{Path, PathBuf};
use std::time::{Duration, SystemTime};

use crate::catalog;
use crate::dataset::{self, changes::Records};
use crate::engine::{Engine, Sources};

/// What a folder's files look like: name, size and modification time of
/// each. Polling this is enough for files editors save by hand, and needs
/// no platform file-event support.
type Fingerprint = Vec<(PathBuf, u64, Option<SystemTime>)>;

fn fingerprint(dir: &Path) -> Fingerprint {
    let mut out: Fingerprint = std::fs::read_dir(dir)
        .map(|entries| {
            entries
                .flatten()
                .filter_map(|e| {
                    let m = e.metadata().ok()?;
                    m.is_file().then(|| (e.path(), m.len(), m.modified().ok()))
                })
                .collect()
        })
        .unwrap_or_default();
    out.sort();
    out
}

/// Watches the configured folders, checking every `every`, until the
/// process ends.
pub async fn watch(engine: Engine, sources: Sources, every: Duration) {
    let data_dir = sources.data.clone();
    let intents_dir = sources.intents.clone();
    let mut data_seen = data_dir.as_deref().map(fingerprint);
    // The version the files were last served as, to tell when a reload
    // replaces changes posted through the admin API.
    let mut files_version = engine.snapshot().data.version;
    let mut intents_seen = intents_dir.as_deref().map(fingerprint);
    loop {
        tokio::time::sleep(every).await;
        let mut problems = Vec::new();
        let mut changed = false;
        if let Some(dir) = &data_dir {
            let now = fingerprint(dir);
            if data_seen.as_ref() != Some(&now) {
                data_seen = Some(now);
                changed = true;
                match dataset::load_dir(dir) {
                    Ok(data) => {
                        let served = engine.snapshot().data.version;
                        if served > files_version {
                            tracing::warn!(
                                replaced = served - files_version,
                                "the changed data files replace versions posted through the admin API"
                            );
                        }
                        match engine.replace_records(Records::of(&data)).await {
                            Ok(v) => files_version = v,
                            Err(e) => problems.push(e.to_string()),
                        }
                    }
                    Err(e) => problems.push(e.to_string()),
                }
            }
        }
        if let Some(dir) = &intents_dir {
            let now = fingerprint(dir);
            if intents_seen.as_ref() != Some(&now) {
                intents_seen = Some(now);
                changed = true;
                match catalog::load_dir(dir) {
                    Ok(c) => engine.replace_catalog(c).await,
                    Err(e) => problems.push(e.to_string()),
                }
            }
        }
        if !changed {
            continue;
        }
        if problems.is_empty() {
            engine.set_reload_error(None);
        } else {
            let problem = problems.join("\n");
            tracing::warn!(problem = %problem, "a changed file does not load; the last good version keeps serving");
            engine.set_reload_error(Some(problem));
        }
    }
}
