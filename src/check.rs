//! `tidings check PATHS`: editors check their files before the service
//! loads them. Every problem is printed as `file:line:column: message`, one
//! per line; the exit code is 1 on any.

use std::path::{Path, PathBuf};

use crate::answers::channel::Channels;
use crate::catalog;
use crate::dataset::{self, LoadError};

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
    // since files refer to each other.
    let folder = p.parent().unwrap_or(Path::new("."));
    if name.ends_with(".json") {
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

/// Data problems name a record; the line and column are where the record's
/// id stands in its file.
fn check_data(dir: &Path) -> Vec<String> {
    match dataset::load_dir(dir) {
        Ok(_) => vec![],
        Err(LoadError::File(m)) => vec![m],
        Err(LoadError::Invalid(problems)) => problems
            .iter()
            .map(|p| {
                let path = dir.join(&p.file);
                let (line, col) = std::fs::read_to_string(&path)
                    .ok()
                    .and_then(|t| locate_record(&t, &p.record))
                    .unwrap_or((1, 1));
                let what = if p.record.is_empty() {
                    p.message.clone()
                } else {
                    format!("record {}: field {}: {}", p.record, p.field, p.message)
                };
                format!("{}:{line}:{col}: {what}", path.display())
            })
            .collect(),
    }
}

/// Where `"id": "<record>"` stands in a JSON text, 1-based.
fn locate_record(text: &str, record: &str) -> Option<(usize, usize)> {
    if record.is_empty() {
        return None;
    }
    let needle = format!("\"{record}\"");
    for (i, line) in text.lines().enumerate() {
        if let Some(c) = line.find(&needle) {
            if line[..c].contains("\"id\"") {
                return Some((i + 1, line[..c].chars().count() + 1));
            }
        }
    }
    None
}

#[cfg(test)]
mod tests {
    use super::locate_record;

    #[test]
    fn a_record_is_found_by_its_id() {
        let t = "[\n  {\"id\": \"p1\"},\n  {\n    \"id\": \"p2\", \"group\": \"p1\"\n  }\n]";
        assert_eq!(locate_record(t, "p2"), Some((4, 11)));
        assert_eq!(locate_record(t, "p1"), Some((2, 10)));
        assert_eq!(locate_record(t, "nobody"), None);
    }
}
