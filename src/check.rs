//! `tidings check PATHS`: editors check their files before the service
//! loads them. Every problem is printed as `file:line:column: message`, one
//! per line; the exit code is 1 on any.

use std::path::{Path, PathBuf};

use crate::answers::channel::Channels;
use crate::catalog;
use crate::dataset::{self, changes, DataProblem, Dataset, LoadError};

/// Checks each path; returns the exit code.
pub fn run(paths: &[PathBuf]) -> i32 {
    let mut problems: Vec<String> = Vec::new();
    for p in paths {
        problems.extend(check_path(p));
    }
    for p in &problems {
        println!("{p}");
    }
    if problems.is_empty() {
        println!("ok: {} checked", paths.len());
        0
    } else {
        println!("{} problem(s)", problems.len());
        1
    }
}

fn check_path(p: &Path) -> Vec<String> {
    let name = p.file_name().and_then(|n| n.to_str()).unwrap_or_default();
    if !p.exists() {
        return vec![format!("{}: no such file or folder", p.display())];
    }
    if p.is_dir() && p.join("scenario.json").exists() {
        return check_data(p);
    }
    if p.is_dir() && is_batch_folder(p) {
        return check_batches(p);
    }
    if p.is_dir() {
        return check_intents(p);
    }
    if name.ends_with("channels.yaml") {
        return match std::fs::read_to_string(p) {
            Ok(text) => {
                let mut problems = Vec::new();
                Channels::with_file(&p.display().to_string(), &text, &mut problems);
                problems.iter().map(|x| x.to_string()).collect()
            }
            Err(e) => vec![format!("{}: cannot read: {e}", p.display())],
        };
    }
    // A single intent or data file is checked with the rest of its folder,
    // since files refer to each other; so is a batch file, which changes
    // the scenario its folder's parent holds.
    let folder = p.parent().unwrap_or(Path::new("."));
    if name.ends_with(".json") && is_batch_folder(folder) {
        check_batches(folder)
    } else if name.ends_with(".json") {
        check_data(folder)
    } else {
        check_intents(folder)
    }
}

fn check_intents(dir: &Path) -> Vec<String> {
    match catalog::load_dir(dir) {
        Ok(_) => vec![],
        Err(e) => e.0.iter().map(|p| p.to_string()).collect(),
    }
}

/// Data problems are located by the loader at the field at fault (or its
/// record, when the field is absent).
fn check_data(dir: &Path) -> Vec<String> {
    match dataset::load_dir(dir) {
        Ok(_) => vec![],
        Err(e) => load_problems(e),
    }
}

fn load_problems(e: LoadError) -> Vec<String> {
    match e {
        LoadError::File(m) => vec![m],
        LoadError::Invalid(problems) => problems.iter().map(located).collect(),
    }
}

/// A problem as `file:line:column: ...`; the rare one that has no place
/// in a text (a batch about a record it did not touch) is put at the top
/// of its file, so every line has the same shape.
fn located(p: &DataProblem) -> String {
    if p.line.is_some() {
        p.to_string()
    } else {
        let mut at = p.clone();
        at.line = Some(1);
        at.column = Some(1);
        at.to_string()
    }
}

/// A folder of batch files for `tidings replay`: `.json` files and no
/// `scenario.json`, inside a scenario folder.
fn is_batch_folder(dir: &Path) -> bool {
    !dir.join("scenario.json").exists()
        && dir
            .parent()
            .is_some_and(|parent| parent.join("scenario.json").exists())
        && std::fs::read_dir(dir).is_ok_and(|rd| {
            rd.flatten()
                .any(|e| e.path().extension().is_some_and(|x| x == "json"))
        })
}

/// Every batch file of the folder, applied in file-name order to the
/// scenario of the folder's parent as the admin API would apply it; each
/// problem at its file, line and column. A batch that is refused leaves the
/// data as they were, so the batches after it are checked against that.
fn check_batches(dir: &Path) -> Vec<String> {
    let scenario = dir.parent().unwrap_or(Path::new("."));
    let mut data: Dataset = match dataset::load_dir(scenario) {
        Ok(d) => d,
        Err(e) => return load_problems(e),
    };
    let mut files: Vec<PathBuf> = match std::fs::read_dir(dir) {
        Ok(rd) => rd
            .flatten()
            .map(|e| e.path())
            .filter(|f| f.extension().is_some_and(|x| x == "json"))
            .collect(),
        Err(e) => return vec![format!("{}: cannot read: {e}", dir.display())],
    };
    files.sort();
    let mut out = Vec::new();
    for f in files {
        let name = f.display().to_string();
        let text = match std::fs::read_to_string(&f) {
            Ok(t) => t,
            Err(e) => {
                out.push(format!("{name}: cannot read: {e}"));
                continue;
            }
        };
        let result = changes::parse(&text).and_then(|batch| {
            // Without its own time a batch keeps the data's, as on replay.
            let as_of = crate::engine::rfc3339(&data.as_of.to_zoned_datetime(data.tz.clone()));
            changes::apply(&data, &batch, &as_of)
        });
        match result {
            Ok(next) => data = next,
            Err(mut problems) => {
                changes::locate(&mut problems, &name, &text);
                out.extend(problems.iter().map(located));
            }
        }
    }
    out
}
