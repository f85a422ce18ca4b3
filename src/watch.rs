//! `tidings serve --watch`: the data and intents folders are read again
//! when their files change, without a restart.
//!
//! A changed folder is loaded and checked whole; only a version that loads
//! is served. A broken file keeps the last good version serving, and its
//! problem (with file:line:column) is logged and shown by
//! `GET /v1/admin/status` until a later change loads.
//!
//! Data files are the starting point of the results, and the admin API
//! changes them live. So once changes have been posted through the admin
//! API, a change to the data files is not loaded over them (that would undo
//! live results on every replica): the status says so, and replacing the
//! whole dataset is then an explicit `PUT /v1/admin/dataset`.

use std::path::{Path, PathBuf};
use std::time::{Duration, SystemTime};

use crate::catalog;
use crate::dataset::{self, changes::Records, load::FILES};
use crate::engine::{Engine, Sources};

/// What a folder's files look like: name, size and modification time of
/// each. Polling this is enough for files editors save by hand, and needs
/// no platform file-event support.
type Fingerprint = Vec<(PathBuf, u64, Option<SystemTime>)>;

/// The files of a folder that matter: `keep` picks them by name (editors'
/// swap and backup files do not).
fn fingerprint(dir: &Path, keep: &dyn Fn(&str) -> bool) -> Fingerprint {
    let mut out: Fingerprint = std::fs::read_dir(dir)
        .map(|entries| {
            entries
                .flatten()
                .filter(|e| e.file_name().to_str().is_some_and(keep))
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

fn is_data_file(name: &str) -> bool {
    FILES.contains(&name)
}

fn is_intents_file(name: &str) -> bool {
    !name.starts_with('.') && (name.ends_with(".yaml") || name.ends_with(".yml"))
}

/// One watched folder: what was last loaded, and its problem if the last
/// change did not load.
struct Watched {
    dir: PathBuf,
    loaded: Fingerprint,
    problem: Option<String>,
}

/// Watches the configured folders, checking every `every`, until the
/// process ends.
pub async fn watch(engine: Engine, sources: Sources, every: Duration) {
    let mut data = sources.data.clone().map(|dir| Watched {
        loaded: fingerprint(&dir, &is_data_file),
        dir,
        problem: None,
    });
    let mut intents = sources.intents.clone().map(|dir| Watched {
        loaded: fingerprint(&dir, &is_intents_file),
        dir,
        problem: None,
    });
    // The version the data files were last served as: a newer one means
    // changes came through the admin API since.
    let mut files_version = engine.snapshot().data.version;
    loop {
        tokio::time::sleep(every).await;
        let mut changed = false;
        if let Some(w) = data.as_mut() {
            let now = fingerprint(&w.dir, &is_data_file);
            if now != w.loaded {
                changed = true;
                let served = engine.snapshot().data.version;
                let outcome = if served > files_version {
                    Err(format!(
                        "{}: the data files changed, but {} change(s) were posted through the admin API since they were read; they were not loaded over them (replace the whole dataset with PUT /v1/admin/dataset, or restart)",
                        w.dir.display(),
                        served - files_version
                    ))
                } else {
                    match dataset::load_dir(&w.dir) {
                        Ok(d) => engine
                            .replace_records(Records::of(&d))
                            .await
                            .map_err(|e| e.to_string()),
                        Err(e) => Err(e.to_string()),
                    }
                };
                match outcome {
                    Ok(v) => {
                        files_version = v;
                        w.loaded = now;
                        w.problem = None;
                    }
                    Err(p) => {
                        // Keep the old fingerprint when the change could
                        // not be applied for want of Redis, so it is tried
                        // again; a file problem waits for the next edit.
                        if !p.contains("shared") {
                            w.loaded = now;
                        }
                        w.problem = Some(p);
                    }
                }
            }
        }
        if let Some(w) = intents.as_mut() {
            let now = fingerprint(&w.dir, &is_intents_file);
            if now != w.loaded {
                changed = true;
                w.loaded = now;
                match catalog::load_dir(&w.dir) {
                    Ok(c) => {
                        engine.replace_catalog(c).await;
                        w.problem = None;
                    }
                    Err(e) => w.problem = Some(e.to_string()),
                }
            }
        }
        if !changed {
            continue;
        }
        let problems: Vec<String> = [&data, &intents]
            .into_iter()
            .flatten()
            .filter_map(|w| w.problem.clone())
            .collect();
        if problems.is_empty() {
            engine.set_reload_error(None);
        } else {
            let problem = problems.join("\n");
            tracing::warn!(problem = %problem, "a change to the files was not loaded; the last good version keeps serving");
            engine.set_reload_error(Some(problem));
        }
    }
}
