//! `tidings replay`: feeds a night's change batches to a running server,
//! in order and at their own pace, so an editor can watch answers change
//! (and a test can stop the night at any point and ask questions).
//!
//! A replay is a folder of batch files (the JSON `POST /v1/admin/batches`
//! takes), played in file-name order. The wait between two batches is the
//! gap between their `as_of` times divided by `--speed`, so a 15-minute gap
//! at speed 60 takes 15 seconds. Every file is read and checked before the
//! first one is sent: a broken file stops the replay before it changes
//! anything, with its `file:line:column`.

use std::path::{Path, PathBuf};
use std::time::Duration;

use jiff::Timestamp;

use crate::dataset::changes::{self, Batch};

/// One batch file, read and parsed.
#[derive(Debug)]
pub struct Step {
    pub path: PathBuf,
    /// The file's text, sent as it is.
    pub body: String,
    pub as_of: Option<Timestamp>,
    /// `as_of` as the file writes it (in the scenario's own offset).
    pub as_of_text: Option<String>,
    pub changes: usize,
}

/// Reads the batch files under `paths` (files, or folders of `.json`
/// files), in file-name order within each folder.
pub fn read_steps(paths: &[PathBuf]) -> Result<Vec<Step>, Vec<String>> {
    let mut files = Vec::new();
    let mut problems = Vec::new();
    for p in paths {
        if p.is_dir() {
            match std::fs::read_dir(p) {
                Ok(rd) => {
                    let mut inside: Vec<PathBuf> = rd
                        .filter_map(|e| e.ok().map(|e| e.path()))
                        .filter(|f| f.extension().is_some_and(|x| x == "json"))
                        .collect();
                    inside.sort();
                    if inside.is_empty() {
                        problems.push(format!("{}: no .json batch files", p.display()));
                    }
                    files.extend(inside);
                }
                Err(e) => problems.push(format!("{}: {e}", p.display())),
            }
        } else {
            files.push(p.clone());
        }
    }
    let mut steps: Vec<Step> = Vec::new();
    let mut latest: Option<(Timestamp, String, PathBuf)> = None;
    for f in files {
        match read_step(&f) {
            Ok(s) => {
                // Played in file-name order, the night must move forward:
                // a batch stamped before the one played ahead of it would
                // turn the data's clock back.
                if let (Some(at), Some((before, said, prev))) = (s.as_of, &latest) {
                    if at < *before {
                        problems.push(format!(
                            "{}: as_of {} is earlier than {said} in {}, which plays first",
                            f.display(),
                            s.as_of_text.as_deref().unwrap_or_default(),
                            prev.display()
                        ));
                    }
                }
                if let (Some(at), Some(said)) = (s.as_of, &s.as_of_text) {
                    latest = Some((at, said.clone(), f.clone()));
                }
                steps.push(s)
            }
            Err(m) => problems.push(m),
        }
    }
    if problems.is_empty() {
        Ok(steps)
    } else {
        Err(problems)
    }
}

fn read_step(path: &Path) -> Result<Step, String> {
    let body = std::fs::read_to_string(path).map_err(|e| format!("{}: {e}", path.display()))?;
    let batch: Batch = changes::parse(&body).map_err(|mut problems| {
        changes::locate(&mut problems, &path.display().to_string(), &body);
        let lines: Vec<String> = problems.iter().map(|p| p.to_string()).collect();
        lines.join("\n")
    })?;
    let as_of = match &batch.as_of {
        None => None,
        Some(t) => Some(t.parse::<Timestamp>().map_err(|e| {
            format!(
                "{}: as_of {t:?} is not an RFC 3339 time ({e})",
                path.display()
            )
        })?),
    };
    Ok(Step {
        path: path.to_path_buf(),
        body,
        as_of,
        as_of_text: batch.as_of.clone(),
        changes: batch.changes.len(),
    })
}

/// How long to wait before `next` after `prev`: the gap between their
/// `as_of` times over `speed`; none when either has no time, when the
/// times go backwards, or at speed 0 (as fast as the server takes them).
pub fn pause(prev: Option<Timestamp>, next: Option<Timestamp>, speed: f64) -> Duration {
    match (prev, next) {
        (Some(a), Some(b)) if speed > 0.0 && b > a => {
            let secs = (b.as_second() - a.as_second()) as f64 / speed;
            Duration::from_secs_f64(secs)
        }
        _ => Duration::ZERO,
    }
}

/// Plays the batches against `server`; prints one line a batch. Returns
/// the process exit code: 1 as soon as the server refuses a batch (later
/// batches build on it, so the replay stops there).
pub async fn run(server: &str, token: &str, paths: &[PathBuf], speed: f64) -> i32 {
    if !speed.is_finite() || speed < 0.0 {
        eprintln!("--speed must be 0 (no waiting) or more");
        return 2;
    }
    let steps = match read_steps(paths) {
        Ok(s) if s.is_empty() => {
            eprintln!("no batch files given");
            return 2;
        }
        Ok(s) => s,
        Err(problems) => {
            for p in problems {
                eprintln!("{p}");
            }
            return 1;
        }
    };
    let url = format!("{}/v1/admin/batches", server.trim_end_matches('/'));
    let client = match reqwest::Client::builder()
        .timeout(Duration::from_secs(30))
        .build()
    {
        Ok(c) => c,
        Err(e) => {
            eprintln!("cannot make an HTTP client: {e}");
            return 1;
        }
    };
    let total = steps.len();
    let mut prev = None;
    for (i, step) in steps.iter().enumerate() {
        let wait = pause(prev, step.as_of, speed);
        if !wait.is_zero() {
            tokio::time::sleep(wait).await;
        }
        prev = step.as_of.or(prev);
        let sent = client
            .post(&url)
            .bearer_auth(token)
            .header("content-type", "application/json")
            .body(step.body.clone())
            .send()
            .await;
        let name = step.path.display();
        let when = step.as_of_text.as_deref().unwrap_or("-");
        match sent {
            Err(e) => {
                eprintln!("[{}/{total}] {name}: the server did not answer: {e}", i + 1);
                return 1;
            }
            Ok(r) => {
                let status = r.status();
                let body: serde_json::Value = r.json().await.unwrap_or_default();
                if status.is_success() {
                    println!(
                        "[{}/{total}] {when} {name}: {} change(s), dataset version {}",
                        i + 1,
                        step.changes,
                        body["dataset_version"]
                    );
                } else {
                    eprintln!(
                        "[{}/{total}] {name}: refused ({status}): {}",
                        i + 1,
                        body["error"]["message"]
                            .as_str()
                            .unwrap_or("no reason given")
                    );
                    return 1;
                }
            }
        }
    }
    0
}

#[cfg(test)]
mod tests {
    use super::*;

    fn t(s: &str) -> Option<Timestamp> {
        Some(s.parse().unwrap())
    }

    #[test]
    fn waits_the_gap_over_the_speed() {
        let a = t("2027-05-06T22:45:00+01:00");
        let b = t("2027-05-06T23:00:00+01:00");
        assert_eq!(pause(a, b, 60.0), Duration::from_secs(15));
        assert_eq!(pause(a, b, 900.0), Duration::from_secs(1));
        assert_eq!(pause(a, b, 0.0), Duration::ZERO);
        // Backwards or missing times: no wait rather than a negative one.
        assert_eq!(pause(b, a, 60.0), Duration::ZERO);
        assert_eq!(pause(None, b, 60.0), Duration::ZERO);
    }

    #[test]
    fn a_broken_file_is_reported_at_its_line_and_column() {
        let dir = std::env::temp_dir().join(format!("tidings-replay-{}", std::process::id()));
        std::fs::create_dir_all(&dir).unwrap();
        std::fs::write(dir.join("01.json"), "{\"changes\": []}").unwrap();
        std::fs::write(
            dir.join("02.json"),
            "{\n  \"changes\": [\n    {\"change\": }\n]}",
        )
        .unwrap();
        let err = read_steps(std::slice::from_ref(&dir)).unwrap_err();
        std::fs::remove_dir_all(&dir).unwrap();
        assert_eq!(err.len(), 1, "{err:?}");
        assert!(err[0].contains("02.json:3:"), "{}", err[0]);
    }

    #[test]
    fn the_shipped_election_night_reads_in_order() {
        let dir = PathBuf::from(concat!(
            env!("CARGO_MANIFEST_DIR"),
            "/dataset-demo/election/replay"
        ));
        let steps = read_steps(&[dir]).unwrap();
        assert!(steps.len() >= 10);
        let times: Vec<Timestamp> = steps.iter().map(|s| s.as_of.unwrap()).collect();
        assert!(
            times.windows(2).all(|w| w[0] < w[1]),
            "as_of must move forward"
        );
    }
}
